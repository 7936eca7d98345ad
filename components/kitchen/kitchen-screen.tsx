import { Screen } from '../ui/screen';
import { EmptyState } from '../ui/states';

/** The kitchen: cooking batches and what is in the fridge and freezer. */
export function KitchenScreen() {
  return (
    <Screen title="Kitchen" subtitle="Cook a batch by weight and split it into labelled portions.">
      <EmptyState title="No batches cooked yet">
        Cooking a batch walks you through weighing each ingredient and the cooked pot, then splits it into containers
        with their carbohydrate and a label.
      </EmptyState>
    </Screen>
  );
}
