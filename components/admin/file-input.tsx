import { Text } from '../ui/text';

/** Dataset files are uploaded from a computer's browser; the native apps point there. */
export function FileInput(_props: { files: File[]; onChange: (files: File[]) => void; accept: string }) {
  return <Text color="textMuted">Upload dataset files from the web app on a computer.</Text>;
}
