import { DOSE_CAUTION } from '../../shared/compute/dose-caution';
import { Callout } from '../ui/callout';
import { Text } from '../ui/text';

/**
 * The safety text every screen showing a suggested dose must show, always visible (DESIGN.md "Safety"): the same text
 * the API sends with every dose answer. Reuse it wherever a dose appears.
 */
export function DoseCaution() {
  return (
    <Callout tone="caution" title={DOSE_CAUTION.title}>
      <Text>{DOSE_CAUTION.text}</Text>
    </Callout>
  );
}
