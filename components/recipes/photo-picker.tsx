import { Text } from '../ui/text';

/** Native builds have no photo chooser yet; the web app does (photo-picker.web.tsx). */
export function PhotoPicker(_props: { label: string; onPick: (file: Blob) => void; loading?: boolean }) {
  return <Text color="textMuted">Add photos from the web app.</Text>;
}
