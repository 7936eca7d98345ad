import { useRef } from 'react';
import { Button } from '../ui/button';

/** Opens the browser's file chooser for one image and hands over the chosen file. */
export function PhotoPicker({ label, onPick, loading }: { label: string; onPick: (file: Blob) => void; loading?: boolean }) {
  const input = useRef<HTMLInputElement>(null);
  return (
    <>
      <input
        ref={input}
        type="file"
        accept="image/jpeg,image/png,image/webp"
        aria-label={label}
        data-testid="recipe-photo-input"
        style={{ display: 'none' }}
        onChange={(e) => {
          const file = e.currentTarget.files?.[0];
          if (file) onPick(file);
          e.currentTarget.value = '';
        }}
      />
      <Button variant="secondary" label={label} loading={loading} onPress={() => input.current?.click()} />
    </>
  );
}
