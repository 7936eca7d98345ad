import { router } from 'expo-router';
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import type { RecipeDetail as Detail } from '../../shared/schemas/recipe';
import { CARB_UNIT_LABEL } from '../../shared/compute/units';
import { ApiError } from '../api/client';
import { useTheme } from '../theme/use-theme';
import { Button } from '../ui/button';
import { Callout } from '../ui/callout';
import { Card } from '../ui/card';
import { ErrorState, LoadingState } from '../ui/states';
import { Text } from '../ui/text';
import { PhotoPicker } from './photo-picker';
import { BASIS_WORDS, VISIBILITY_WORDS, showCarb, showGrams } from './recipe-format';
import { RecipePhoto } from './recipe-photo';
import { useCopyRecipe, useDeleteRecipe, useRecipe, useUploadRecipePhoto, type RecipeView } from '../api/recipes';
import { SharePanel } from './share-panel';

const SCALES = [
  { label: '× ½', factor: 0.5 },
  { label: 'As written', factor: 1 },
  { label: '× 2', factor: 2 },
  { label: '× 3', factor: 3 },
];

/** The recipe page body: photo, carbohydrate per portion and per 100 g, ingredients, method, sharing and actions. */
export function RecipeDetailView({ id, profileId }: { id: number; profileId?: number }) {
  const [factor, setFactor] = useState(1);
  const view: RecipeView = { profileId, factor: factor === 1 ? undefined : factor };
  const recipe = useRecipe(id, view);
  if (recipe.isPending) return <LoadingState label="Loading the recipe…" />;
  if (recipe.isError) return <ErrorState error={recipe.error} onRetry={recipe.refetch} />;
  return <RecipeBody recipe={recipe.data} factor={factor} onScale={setFactor} />;
}

function RecipeBody({ recipe, factor, onScale }: { recipe: Detail; factor: number; onScale: (f: number) => void }) {
  const t = useTheme();
  const n = recipe.nutrition;
  const unit = recipe.unit;
  const copy = useCopyRecipe();
  const remove = useDeleteRecipe();
  const photo = useUploadRecipePhoto(recipe.id);
  const [confirmDelete, setConfirmDelete] = useState(false);
  const photoError = photo.error instanceof ApiError ? (photo.error.fieldErrors?.photo?.[0] ?? photo.error.message) : undefined;

  return (
    <View style={styles.stack}>
      <RecipePhoto photo={recipe.photo} title={recipe.title} size="large" />
      <View style={styles.stackTight}>
        <Text variant="title" aria-level={2}>
          {recipe.title}
        </Text>
        <Text color="textMuted">
          {recipe.isOwner ? `Yours · ${VISIBILITY_WORDS[recipe.visibility]}` : `Shared by ${recipe.owner.displayName}`}
          {recipe.copiedFrom ? ` · copied from “${recipe.copiedFrom.title}”` : ''}
        </Text>
        {recipe.tags.length ? <Text variant="caption" color="textMuted">{recipe.tags.map((tag) => `#${tag}`).join('  ')}</Text> : null}
        {recipe.description ? <Text>{recipe.description}</Text> : null}
      </View>

      <Card aria-label="Carbohydrate">
        <View style={styles.numbers}>
          <View style={styles.number}>
            <Text variant="caption" color="textMuted">
              Per portion (1 of {n.portions})
            </Text>
            <Text variant="number" testID="carb-per-portion">
              {showCarb(n.carbPerPortion, unit)}
            </Text>
            <Text variant="caption" color="textMuted">
              about {showGrams(n.portionGrams)} raw each
            </Text>
          </View>
          <View style={styles.number}>
            <Text variant="caption" color="textMuted">
              Per 100 g raw mixture
            </Text>
            <Text variant="number" testID="carb-per-100g">
              {showCarb(n.carbPer100gRaw, unit)}
            </Text>
            <Text variant="caption" color="textMuted">
              whole recipe {showCarb(n.carbTotal, unit)} in {showGrams(n.rawWeightGrams)}
            </Text>
          </View>
        </View>
        <Text variant="caption" color="textMuted">
          Counted as {BASIS_WORDS[recipe.basis]}
          {unit === 'g' ? '' : `, in ${CARB_UNIT_LABEL[unit].long}`}. Cooking changes the weight, not the carbohydrate: weigh
          the cooked batch in the Kitchen for per-100 g cooked values.
        </Text>
        {n.carbIncomplete ? (
          <Callout tone="caution" title="Some carbohydrate is unknown">
            At least one ingredient has no {recipe.basis} carbohydrate value, so these figures are too low. Check the
            ingredients marked “unknown”.
          </Callout>
        ) : null}
        <View style={styles.row} role="group" aria-label="Scale">
          {SCALES.map((s) => (
            <Button
              key={s.label}
              variant={factor === s.factor ? 'primary' : 'secondary'}
              label={s.label}
              onPress={() => onScale(s.factor)}
              aria-pressed={factor === s.factor}
            />
          ))}
        </View>
      </Card>

      <Card>
        <Text variant="heading">Ingredients</Text>
        <View role="list" aria-label="Ingredients">
          {recipe.ingredients.map((line, i) => (
            <View key={line.id} role="listitem" style={[styles.line, { borderColor: t.colors.border }]}>
              <View style={styles.grow}>
                <Text weight="bold">{line.food.name}</Text>
                <Text variant="caption" color="textMuted">
                  {[line.measureLabel, line.note].filter(Boolean).join(' · ') || line.food.attribution}
                </Text>
              </View>
              <Text style={styles.cell}>{showGrams(line.grams)}</Text>
              <Text style={styles.cell} weight="bold">
                {showCarb(n.ingredients[i].carb, unit)}
              </Text>
            </View>
          ))}
        </View>
      </Card>

      {recipe.methodSteps.length ? (
        <Card>
          <Text variant="heading">Method</Text>
          {recipe.methodSteps.map((step, i) => (
            <Text key={i}>
              {i + 1}. {step}
            </Text>
          ))}
        </Card>
      ) : null}

      <View style={styles.row}>
        {recipe.isOwner ? (
          <>
            <Button label="Edit" onPress={() => router.push(`/recipes/${recipe.id}/edit`)} />
            <PhotoPicker label={recipe.photo ? 'Change photo' : 'Add photo'} onPick={(file) => photo.mutate(file)} loading={photo.isPending} />
          </>
        ) : null}
        <Button variant="secondary" label="Cook a batch" onPress={() => router.push(`/kitchen/cook/${recipe.id}`)} />
        <Button
          variant="secondary"
          label={recipe.isOwner ? 'Duplicate' : 'Copy to my recipes'}
          loading={copy.isPending}
          onPress={() => copy.mutate(recipe.id, { onSuccess: (made) => router.push(`/recipes/${made.id}`) })}
        />
        {recipe.isOwner ? (
          <Button variant="danger" label={confirmDelete ? 'Yes, delete it' : 'Delete'} onPress={() => {
            if (!confirmDelete) return setConfirmDelete(true);
            remove.mutate(recipe.id, { onSuccess: () => router.replace('/recipes') });
          }} />
        ) : null}
      </View>
      {photoError ? <Callout tone="danger" title="Photo not saved">{photoError}</Callout> : null}
      {confirmDelete ? (
        <Callout tone="caution" title="Delete this recipe?">
          Batches already cooked from it keep their own weighed numbers. Copies other people made stay theirs.
        </Callout>
      ) : null}
      {recipe.isOwner && recipe.sharedWith ? <SharePanel recipeId={recipe.id} shares={recipe.sharedWith} /> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  stack: { gap: 16 },
  stackTight: { gap: 4 },
  numbers: { flexDirection: 'row', flexWrap: 'wrap', gap: 24 },
  number: { minWidth: 140, gap: 2 },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: 8 },
  line: { flexDirection: 'row', alignItems: 'center', gap: 12, paddingVertical: 10, borderBottomWidth: StyleSheet.hairlineWidth },
  grow: { flex: 1, minWidth: 0 },
  cell: { minWidth: 64, textAlign: 'right' },
});
