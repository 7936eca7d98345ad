import { Text } from '../ui/text';
import type { FileInputProps } from './file-input.web';

/** Files are uploaded from a computer's browser; the native apps point there. */
export function FileInput({ label = 'Dataset files' }: FileInputProps) {
  return <Text color="textMuted">Upload {label.toLowerCase()} from the web app on a computer.</Text>;
}
