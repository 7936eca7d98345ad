import { router } from 'expo-router';
import type { IFuseOptions } from 'fuse.js';
import { useDeferredValue, useMemo, useState } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';
import type { RecipeScope, RecipeSort, RecipeSummary } from '../../shared/schemas/recipe';
import { useActiveProfile } from '../api/auth';
import { RecipeOffers } from './recipe-offers';
import { useLayout, useTheme } from '../theme/use-theme';
import { Button } from '../ui/button';
import { Card } from '../ui/card';
import { Screen } from '../ui/screen';
import { EmptyState, ErrorState, LoadingState } from '../ui/states';
import { Text } from '../ui/text';
import { TextField } from '../ui/text-field';
import { useFuse } from '../ui/use-fuse';
import { RecipeDetailView } from './recipe-detail';
import { showCarb } from './recipe-format';
import { RecipePhoto } from './recipe-photo';
import { useRecipes } from '../api/recipes';

const RECIPE_SEARCH: IFuseOptions<RecipeSummary> = { keys: ['title', 'tags', 'ingredientNames'], threshold: 0.35, ignoreLocation: true };
const NO_RECIPES: RecipeSummary[] = [];

const SCOPES: { value: RecipeScope; label: string }[] = [
  { value: 'mine', label: 'Mine' },
  { value: 'shared', label: 'Shared with me' },
  { value: 'public', label: 'Public' },
];
const SORTS: { value: RecipeSort; label: string }[] = [
  { value: 'recent', label: 'Recently changed' },
  { value: 'cooked', label: 'Recently cooked' },
  { value: 'carbPerPortion', label: 'Carbohydrate per portion' },
  { value: 'title', label: 'A–Z' },
];

/** The recipe library: shelves, search, sort; on a wide screen the list and the chosen recipe side by side. */
export function RecipesScreen() {
  const { isWide } = useLayout();
  const { profile } = useActiveProfile();
  const [scope, setScope] = useState<RecipeScope>('mine');
  const [sort, setSort] = useState<RecipeSort>('recent');
  const [text, setText] = useState('');
  const [selected, setSelected] = useState<number>();
  const serverQ = useDeferredValue(text.trim().length >= 3 ? text.trim() : '');
  const recipes = useRecipes({ scope, sort, q: serverQ, profileId: profile?.id });
  const fuse = useFuse(recipes.data ?? NO_RECIPES, RECIPE_SEARCH);
  const shown: RecipeSummary[] = useMemo(() => {
    const needle = text.trim();
    if (!needle || !recipes.data || !fuse) return recipes.data ?? [];
    return fuse.search(needle).map((r) => r.item).sort((a, b) => (recipes.data!.indexOf(a) - recipes.data!.indexOf(b)));
  }, [fuse, recipes.data, text]);
  const open = (id: number) => (isWide ? setSelected(id) : router.push(`/recipes/${id}`));
  const current = isWide ? (selected ?? shown[0]?.id) : undefined;

  const list = (
    <View style={styles.stack}>
      <RecipeOffers />
      <View style={styles.row} role="tablist" aria-label="Shelves">
        {SCOPES.map((s) => (
          <Button
            key={s.value}
            role="tab"
            aria-selected={scope === s.value}
            variant={scope === s.value ? 'primary' : 'secondary'}
            label={s.label}
            onPress={() => setScope(s.value)}
          />
        ))}
      </View>
      <TextField label="Search by title, tag or ingredient" value={text} onChangeText={setText} placeholder="e.g. lentil, breakfast, oats" />
      <View style={styles.row} role="radiogroup" aria-label="Sort by">
        {SORTS.map((s) => (
          <Button
            key={s.value}
            role="radio"
            aria-checked={sort === s.value}
            variant={sort === s.value ? 'primary' : 'quiet'}
            label={s.label}
            onPress={() => setSort(s.value)}
          />
        ))}
      </View>
      {recipes.isPending ? (
        <LoadingState label="Loading recipes…" />
      ) : recipes.isError ? (
        <ErrorState error={recipes.error} onRetry={recipes.refetch} />
      ) : shown.length === 0 ? (
        <EmptyState title={text ? 'Nothing matches' : scope === 'mine' ? 'No recipes yet' : scope === 'shared' ? 'Nothing shared with you yet' : 'The public shelf is empty'}>
          {text
            ? 'Try another word: a title, a tag or one of the ingredients.'
            : scope === 'mine'
              ? 'Build a recipe from weighed ingredients and every portion gets a known carbohydrate value.'
              : 'Recipes appear here when someone shares one with your email address or makes one public.'}
        </EmptyState>
      ) : (
        <View role="list" aria-label="Recipes" style={styles.stack}>
          {shown.map((r) => (
            <RecipeRow key={r.id} recipe={r} selected={current === r.id} onPress={() => open(r.id)} />
          ))}
        </View>
      )}
    </View>
  );

  return (
    <Screen
      title="Recipes"
      subtitle="Your library, recipes shared with you, and the public shelf."
      actions={<Button label="New recipe" onPress={() => router.push('/recipes/new')} />}
    >
      {isWide ? (
        <View style={styles.panes}>
          <View style={styles.listPane}>{list}</View>
          <View style={styles.detailPane} aria-label="Chosen recipe">
            {current ? <RecipeDetailView key={current} id={current} profileId={profile?.id} /> : <Text color="textMuted">Choose a recipe to see it here.</Text>}
          </View>
        </View>
      ) : (
        list
      )}
    </Screen>
  );
}

function RecipeRow({ recipe, selected, onPress }: { recipe: RecipeSummary; selected: boolean; onPress: () => void }) {
  const t = useTheme();
  return (
    <Pressable role="listitem" onPress={onPress} aria-current={selected || undefined} aria-label={recipe.title}>
      <Card style={[styles.rowCard, selected && { borderColor: t.colors.primary, borderWidth: 2 }]}>
        <RecipePhoto photo={recipe.photo} title={recipe.title} size="thumb" />
        <View style={styles.grow}>
          <Text weight="bold">{recipe.title}</Text>
          <Text variant="caption" color="textMuted" numberOfLines={1}>
            {recipe.isOwner ? `${recipe.defaultPortions} portions` : `by ${recipe.owner.displayName} · ${recipe.defaultPortions} portions`}
            {recipe.tags.length ? ` · ${recipe.tags.join(', ')}` : ''}
          </Text>
        </View>
        <View style={styles.carb}>
          <Text variant="heading">{showCarb(recipe.carbPerPortionGrams, recipe.unit)}</Text>
          <Text variant="caption" color="textMuted">
            per portion{recipe.carbIncomplete ? ' (incomplete)' : ''}
          </Text>
        </View>
      </Card>
    </Pressable>
  );
}

const styles = StyleSheet.create({
  stack: { gap: 12 },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: 8 },
  panes: { flexDirection: 'row', gap: 24, alignItems: 'flex-start' },
  listPane: { width: 420, flexShrink: 0 },
  detailPane: { flex: 1, minWidth: 0 },
  rowCard: { flexDirection: 'row', alignItems: 'center', gap: 12 },
  grow: { flex: 1, minWidth: 0, gap: 2 },
  carb: { alignItems: 'flex-end' },
});
