import type { PlanWarning } from '../../shared/compute/plan';
import { Callout } from '../ui/callout';
import { Text } from '../ui/text';

const DANGER = new Set(['past_use_by', 'over_placed']);

/** The plan's warnings, above its numbers. */
export function PlanWarnings({ warnings }: { warnings: PlanWarning[] }) {
  if (!warnings.length) return null;
  return (
    <Callout tone={warnings.some((w) => DANGER.has(w.code)) ? 'danger' : 'caution'} title={`Check ${warnings.length === 1 ? 'this' : `these ${warnings.length} things`} before the week`}>
      {warnings.map((w, i) => (
        <Text key={i}>• {w.message}</Text>
      ))}
    </Callout>
  );
}
