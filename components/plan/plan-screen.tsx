import { Screen } from '../ui/screen';
import { EmptyState } from '../ui/states';

/** The week's plan. */
export function PlanScreen() {
  return (
    <Screen title="Plan" subtitle="The week ahead: kinds of day, meals and what to cook.">
      <EmptyState title="No week planned yet">
        A plan gives each day its kind (a rest day, a training day) and each meal a portion, then totals the
        carbohydrate and lists the batches to cook and what to buy.
      </EmptyState>
    </Screen>
  );
}
