import { useRef } from 'react';
import { StyleSheet, View } from 'react-native';
import type { PackPhotoFile } from '../api/foods';
import { Button } from '../ui/button';
import { Text } from '../ui/text';

/** Chooses one image file (camera on phones that offer it). */
export function PhotoInput({ value, onChange }: { value: PackPhotoFile | null; onChange: (file: PackPhotoFile | null) => void }) {
  const input = useRef<HTMLInputElement | null>(null);
  return (
    <View style={styles.row}>
      <input
        ref={input}
        type="file"
        accept="image/jpeg,image/png,image/webp"
        capture="environment"
        aria-label="Label photo"
        data-testid="label-photo-input"
        style={{ display: 'none' }}
        onChange={(e) => {
          const file = e.currentTarget.files?.[0];
          onChange(file ? { blob: file, name: file.name } : null);
        }}
      />
      <Button variant="secondary" label={value ? 'Choose another photo' : 'Add a photo of the label'} onPress={() => input.current?.click()} />
      {value ? (
        <>
          <Text color="textMuted">{value.name}</Text>
          <Button variant="quiet" label="Remove photo" onPress={() => onChange(null)} />
        </>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({ row: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: 12 } });
