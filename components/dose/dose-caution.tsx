import { Callout } from '../ui/callout';
import { Text } from '../ui/text';

/**
 * The safety text every screen showing a suggested dose must show, always visible (DESIGN.md "Safety").
 * Reuse it wherever a dose appears.
 */
export function DoseCaution() {
  return (
    <Callout tone="caution" title="A calculation, not medical advice">
      <Text>
        This is arithmetic from your own settings. Your ratios, targets and limits must come from your diabetes team. Check
        your glucose first, treat a low before anything else, and follow your local clinical guidance. If a number looks
        wrong, do not inject it.
      </Text>
    </Callout>
  );
}
