import { zodResolver } from '@hookform/resolvers/zod';
import { useQueryClient } from '@tanstack/react-query';
import { router } from 'expo-router';
import { useMemo, useState } from 'react';
import { useFieldArray, useForm, useWatch } from 'react-hook-form';
import { computeRecipe } from '../../shared/compute/recipe';
import type { RecipeDetail, RecipeInputParsed } from '../../shared/schemas/recipe';
import { useActiveProfile } from '../api/auth';
import { foodQueryOptions } from '../api/foods';
import { useCreateRecipe, useRecipe, useUpdateRecipe } from '../api/recipes';
import { FoodSearchField } from '../foods/food-search-field';
import { Button } from '../ui/button';
import { Callout } from '../ui/callout';
import { Card } from '../ui/card';
import { applyServerErrors } from '../ui/form-errors';
import { FormChoiceGroup } from '../ui/form-choice-group';
import { FormTextField } from '../ui/form-text-field';
import { Screen } from '../ui/screen';
import { ErrorState, LoadingState } from '../ui/states';
import { Text } from '../ui/text';
import { IngredientRow } from './ingredient-row';
import { VISIBILITY_WORDS, showCarb } from './recipe-format';
import { recipeFieldOf, recipeFormSchema, recipeFormValues, typedNumber, type RecipeFormValues } from './recipe-request';

/** Create (no id) or edit (id) a recipe; the edit form waits for the saved recipe. */
export function RecipeEditorScreen({ id }: { id?: number }) {
  const existing = useRecipe(id, {}, id !== undefined);
  if (id !== undefined && existing.isPending) return <Screen title="Edit recipe" backHref={`/recipes/${id}`}><LoadingState /></Screen>;
  if (id !== undefined && existing.isError) return <Screen title="Edit recipe" backHref="/recipes"><ErrorState error={existing.error} onRetry={existing.refetch} /></Screen>;
  return <RecipeEditor id={id} initial={recipeFormValues(existing.data)} />;
}

function RecipeEditor({ id, initial }: { id?: number; initial: RecipeFormValues }) {
  const form = useForm<RecipeFormValues, unknown, RecipeInputParsed>({ resolver: zodResolver(recipeFormSchema), defaultValues: initial });
  const lines = useFieldArray({ control: form.control, name: 'ingredients' });
  const [formError, setFormError] = useState<string>();
  const { profile } = useActiveProfile();
  const queryClient = useQueryClient();
  const create = useCreateRecipe();
  const update = useUpdateRecipe(id ?? 0);
  const ingredients = useWatch({ control: form.control, name: 'ingredients' });
  const portionsText = useWatch({ control: form.control, name: 'portions' });
  const visibility = useWatch({ control: form.control, name: 'visibility' });
  const { errors } = form.formState;

  const preview = useMemo(() => {
    const portions = typedNumber(portionsText);
    const rows = ingredients.map((l) => ({ grams: typedNumber(l.grams), per100g: l.per100g }));
    if (!Number.isInteger(portions) || portions < 1 || !rows.length || rows.some((l) => !(l.grams > 0))) return null;
    return computeRecipe(rows, { portions, basis: profile?.carbBasis ?? 'available', unit: profile?.carbUnit ?? 'g' });
  }, [ingredients, portionsText, profile?.carbBasis, profile?.carbUnit]);

  const submit = form.handleSubmit(
    (input) => {
      setFormError(undefined);
      const onSuccess = (saved: RecipeDetail) => router.replace(`/recipes/${saved.id}`);
      const onError = (err: Error) => setFormError(applyServerErrors(err, form.setError, recipeFieldOf) ?? err.message);
      if (id === undefined) create.mutate(input, { onSuccess, onError });
      else update.mutate(input, { onSuccess, onError });
    },
    () => setFormError('Some fields need a look before this can be saved.'),
  );

  const addFood = (food: { id: number; name: string; per100g: RecipeFormValues['ingredients'][number]['per100g'] }) => {
    form.clearErrors('ingredients');
    lines.append({ foodId: food.id, foodName: food.name, per100g: food.per100g, measures: [], grams: '', measureLabel: '', note: '' }, { shouldFocus: false });
    const index = form.getValues('ingredients').length - 1;
    queryClient
      .fetchQuery(foodQueryOptions(food.id))
      .then((full) => form.getValues(`ingredients.${index}.foodId`) === food.id && form.setValue(`ingredients.${index}.measures`, full.measures ?? []))
      .catch(() => undefined);
  };

  const ingredientsError = errors.ingredients?.message ?? errors.ingredients?.root?.message;
  return (
    <Screen title={id === undefined ? 'New recipe' : 'Edit recipe'} backHref={id === undefined ? '/recipes' : `/recipes/${id}`}>
      {formError ? <Callout tone="danger" title="Not saved">{formError}</Callout> : null}
      <Card>
        <FormTextField control={form.control} name="title" label="Title" placeholder="e.g. Red lentil soup" />
        <FormTextField control={form.control} name="description" label="Description (optional)" multiline />
        <FormTextField control={form.control} name="portions" label="Portions" inputMode="numeric" unit="portions" />
        <FormTextField control={form.control} name="tags" label="Tags (separated by commas)" placeholder="breakfast, freezer" autoCapitalize="none" />
      </Card>

      <Card>
        <Text variant="heading">Ingredients</Text>
        <Text color="textMuted">Raw weights in grams, as they go into the pot.</Text>
        {ingredientsError ? <Callout tone="danger">{ingredientsError}</Callout> : null}
        {lines.fields.map((line, index) => (
          <IngredientRow key={line.id} control={form.control} index={index} count={lines.fields.length} onMove={lines.move} onRemove={lines.remove} />
        ))}
        <FoodSearchField label="Add an ingredient" verb="Add" onPick={addFood} />
      </Card>

      {preview ? (
        <Card aria-label="Preview">
          <Text variant="caption" color="textMuted">
            Preview (saved values are computed again by the server)
          </Text>
          <Text variant="heading">
            {showCarb(preview.carbPerPortion, preview.unit)} per portion · {showCarb(preview.carbPer100gRaw, preview.unit)} per 100 g raw
          </Text>
        </Card>
      ) : null}

      <Card>
        <FormTextField control={form.control} name="steps" label="Method (one step per line)" multiline numberOfLines={6} />
      </Card>

      <Card>
        <FormChoiceGroup
          control={form.control}
          name="visibility"
          label="Who can see it"
          choices={(['private', 'shared', 'public'] as const).map((v) => ({ value: v, label: VISIBILITY_WORDS[v] }))}
        />
        {visibility === 'private' && id !== undefined ? (
          <Text variant="caption" color="textMuted">
            Saving as “only you” stops sharing with everyone it was shared with.
          </Text>
        ) : null}
      </Card>

      <Button size="lg" label={id === undefined ? 'Save recipe' : 'Save changes'} loading={create.isPending || update.isPending} onPress={() => void submit()} />
    </Screen>
  );
}
