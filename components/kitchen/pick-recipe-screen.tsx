import { router } from 'expo-router';
import { useState } from 'react';
import { useActiveProfile } from '../api/auth';
import { Button } from '../ui/button';
import { Card } from '../ui/card';
import { Screen } from '../ui/screen';
import { EmptyState, ErrorState, LoadingState } from '../ui/states';
import { Text } from '../ui/text';
import { TextField } from '../ui/text-field';
import { useCookableRecipes } from '../api/recipes';

/** Choose the recipe to cook: your own, shared with you, or public. */
export function PickRecipeScreen() {
  const { profile } = useActiveProfile();
  const recipes = useCookableRecipes(profile?.id);
  const [q, setQ] = useState('');
  const needle = q.trim().toLowerCase();
  const list = (recipes.data ?? []).filter((r) => !needle || r.title.toLowerCase().includes(needle));
  return (
    <Screen title="Cook a batch" subtitle="Pick the recipe you are about to cook." backHref="/kitchen">
      <TextField label="Filter recipes" value={q} onChangeText={setQ} placeholder="Title" />
      {recipes.isPending ? (
        <LoadingState />
      ) : recipes.isError ? (
        <ErrorState error={recipes.error} onRetry={recipes.refetch} />
      ) : list.length === 0 ? (
        <EmptyState title="No recipe to cook" action={<Button label="Go to recipes" onPress={() => router.push('/recipes')} />}>
          Write a recipe with weighed ingredients first, or copy one from the public library.
        </EmptyState>
      ) : (
        list.map((r) => (
          <Card key={r.id}>
            <Text variant="heading">{r.title}</Text>
            <Text color="textMuted">
              {r.isOwner ? 'Yours' : `From ${r.owner.displayName}`} · {r.defaultPortions} portions
            </Text>
            <Button label={`Cook ${r.title}`} onPress={() => router.push(`/kitchen/cook/${r.id}`)} />
          </Card>
        ))
      )}
    </Screen>
  );
}
