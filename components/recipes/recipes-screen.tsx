import { Screen } from '../ui/screen';
import { EmptyState } from '../ui/states';

/** The recipe library. */
export function RecipesScreen() {
  return (
    <Screen title="Recipes" subtitle="Your library, recipes shared with you, and the public shelf.">
      <EmptyState title="No recipes yet">
        Recipes are built from weighed ingredients out of an open food table, so every portion has a known
        carbohydrate value.
      </EmptyState>
    </Screen>
  );
}
