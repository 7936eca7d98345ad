import { Text } from './text';

/** The line under a form field: its error when there is one (announced), else its hint. */
export function FieldMessage({ hint, error }: { hint?: string; error?: string }) {
  if (error) {
    return (
      <Text variant="caption" color="danger" role="alert">
        {error}
      </Text>
    );
  }
  if (!hint) return null;
  return (
    <Text variant="caption" color="textMuted">
      {hint}
    </Text>
  );
}
