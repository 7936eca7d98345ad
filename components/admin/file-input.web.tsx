import { useRef } from 'react';
import { StyleSheet, View } from 'react-native';
import { Button } from '../ui/button';
import { Text } from '../ui/text';

export type FileInputProps = { files: File[]; onChange: (files: File[]) => void; accept: string; label?: string; multiple?: boolean; testId?: string };

/** Chooses files (several unless `multiple` is false) from the computer. */
export function FileInput({ files, onChange, accept, label = 'Dataset files', multiple = true, testId = 'dataset-files-input' }: FileInputProps) {
  const input = useRef<HTMLInputElement | null>(null);
  return (
    <View style={styles.wrap}>
      <input
        ref={input}
        type="file"
        multiple={multiple}
        accept={accept}
        aria-label={label}
        data-testid={testId}
        style={{ display: 'none' }}
        onChange={(e) => onChange(Array.from(e.currentTarget.files ?? []))}
      />
      <Button variant="secondary" label={files.length ? (multiple ? 'Choose other files' : 'Choose another file') : multiple ? 'Choose files' : 'Choose a file'} onPress={() => input.current?.click()} />
      {files.map((f) => (
        <Text key={f.name} color="textMuted">
          {f.name} · {(f.size / 1024).toFixed(0)} KB
        </Text>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({ wrap: { gap: 6, alignItems: 'flex-start' } });
