import { useRef } from 'react';
import { StyleSheet, View } from 'react-native';
import { Button } from '../ui/button';
import { Text } from '../ui/text';

/** Chooses several files from the computer. */
export function FileInput({ files, onChange, accept }: { files: File[]; onChange: (files: File[]) => void; accept: string }) {
  const input = useRef<HTMLInputElement | null>(null);
  return (
    <View style={styles.wrap}>
      <input
        ref={input}
        type="file"
        multiple
        accept={accept}
        aria-label="Dataset files"
        data-testid="dataset-files-input"
        style={{ display: 'none' }}
        onChange={(e) => onChange(Array.from(e.currentTarget.files ?? []))}
      />
      <Button variant="secondary" label={files.length ? 'Choose other files' : 'Choose files'} onPress={() => input.current?.click()} />
      {files.map((f) => (
        <Text key={f.name} color="textMuted">
          {f.name} · {(f.size / 1024).toFixed(0)} KB
        </Text>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({ wrap: { gap: 6, alignItems: 'flex-start' } });
