import type { PackPhotoFile } from '../api/foods';
import { Text } from '../ui/text';

/** On the native apps a label photo cannot be attached yet; the web app (phone browser included) can. */
export function PhotoInput(_props: { value: PackPhotoFile | null; onChange: (file: PackPhotoFile | null) => void }) {
  return <Text color="textMuted">Attaching a label photo works in the browser version for now.</Text>;
}
