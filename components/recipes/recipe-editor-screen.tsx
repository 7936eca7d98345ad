import { router } from 'expo-router';
import { useMemo, useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { computeRecipe } from '../../shared/compute/recipe';
import type { Nutrients } from '../../shared/compute/nutrients';
import type { Food, FoodMeasure } from '../../shared/schemas/food';
import { recipeInputSchema, type RecipeDetail, type RecipeInput, type RecipeVisibility } from '../../shared/schemas/recipe';
import { useActiveProfile } from '../api/auth';
import { ApiError, apiFetch } from '../api/client';
import { Button } from '../ui/button';
import { Callout } from '../ui/callout';
import { Card } from '../ui/card';
import { Screen } from '../ui/screen';
import { ErrorState, LoadingState } from '../ui/states';
import { Text } from '../ui/text';
import { TextField } from '../ui/text-field';
import { FoodSearch, type PickedFood } from './food-search';
import { VISIBILITY_WORDS, showCarb, showGrams } from './recipe-format';
import { useCreateRecipe, useRecipe, useUpdateRecipe } from '../api/recipes';

type Line = { key: number; food: PickedFood; grams: string; measureLabel: string; note: string; measures: FoodMeasure[] };
type Draft = { title: string; description: string; portions: string; tags: string; steps: string; visibility: RecipeVisibility; lines: Line[] };
type Errors = Record<string, string>;

let nextKey = 1;
const toNumber = (s: string) => (s.trim() === '' ? Number.NaN : Number(s.replace(',', '.')));

function draftFrom(recipe?: RecipeDetail): Draft {
  if (!recipe) return { title: '', description: '', portions: '4', tags: '', steps: '', visibility: 'private', lines: [] };
  return {
    title: recipe.title,
    description: recipe.description,
    portions: String(recipe.defaultPortions),
    tags: recipe.tags.join(', '),
    steps: recipe.methodSteps.join('\n'),
    visibility: recipe.visibility,
    lines: recipe.ingredients.map((i) => ({
      key: nextKey++,
      food: { id: i.food.id, name: i.food.name, per100g: i.food.per100g },
      grams: String(i.grams),
      measureLabel: i.measureLabel ?? '',
      note: i.note ?? '',
      measures: i.food.measures ?? [],
    })),
  };
}

function toInput(d: Draft): RecipeInput {
  return {
    title: d.title,
    description: d.description,
    defaultPortions: toNumber(d.portions),
    tags: d.tags.split(',').map((t) => t.trim()).filter(Boolean),
    methodSteps: d.steps.split('\n').map((s) => s.trim()).filter(Boolean),
    visibility: d.visibility,
    ingredients: d.lines.map((l) => ({ foodId: l.food.id, grams: toNumber(l.grams), measureLabel: l.measureLabel || null, note: l.note || null })),
  };
}

/** Create (no id) or edit (id) a recipe; the edit form waits for the saved recipe. */
export function RecipeEditorScreen({ id }: { id?: number }) {
  const existing = useRecipe(id, {}, id !== undefined);
  if (id !== undefined && existing.isPending) return <Screen title="Edit recipe" backHref={`/recipes/${id}`}><LoadingState /></Screen>;
  if (id !== undefined && existing.isError) return <Screen title="Edit recipe" backHref="/recipes"><ErrorState error={existing.error} onRetry={existing.refetch} /></Screen>;
  return <RecipeEditor id={id} initial={draftFrom(existing.data)} />;
}

function RecipeEditor({ id, initial }: { id?: number; initial: Draft }) {
  const [draft, setDraft] = useState<Draft>(initial);
  const [errors, setErrors] = useState<Errors>({});
  const [formError, setFormError] = useState<string>();
  const { profile } = useActiveProfile();
  const create = useCreateRecipe();
  const update = useUpdateRecipe(id ?? 0);
  const saving = create.isPending || update.isPending;
  const set = (patch: Partial<Draft>) => setDraft((d) => ({ ...d, ...patch }));
  const clearError = (key: string) => setErrors(({ [key]: _gone, ...rest }) => rest);
  const setLine = (key: number, patch: Partial<Line>) => set({ lines: draft.lines.map((l) => (l.key === key ? { ...l, ...patch } : l)) });
  const move = (index: number, by: number) => {
    const lines = [...draft.lines];
    const [line] = lines.splice(index, 1);
    lines.splice(Math.max(0, Math.min(lines.length, index + by)), 0, line);
    set({ lines });
  };

  const preview = useMemo(() => {
    const portions = toNumber(draft.portions);
    const lines = draft.lines.map((l) => ({ grams: toNumber(l.grams), per100g: l.food.per100g as Nutrients }));
    if (!Number.isInteger(portions) || portions < 1 || !lines.length || lines.some((l) => !(l.grams > 0))) return null;
    return computeRecipe(lines, { portions, basis: profile?.carbBasis ?? 'available', unit: profile?.carbUnit ?? 'g' });
  }, [draft.lines, draft.portions, profile?.carbBasis, profile?.carbUnit]);

  const submit = () => {
    const input = toInput(draft);
    const parsed = recipeInputSchema.safeParse(input);
    if (!parsed.success) {
      const out: Errors = {};
      for (const issue of parsed.error.issues) out[issue.path.join('.') || '_'] ??= issue.message;
      setErrors(out);
      setFormError('Some fields need a look before this can be saved.');
      return;
    }
    setErrors({});
    setFormError(undefined);
    const onError = (err: Error) => {
      if (err instanceof ApiError && err.fieldErrors) {
        setErrors(Object.fromEntries(Object.entries(err.fieldErrors).map(([k, v]) => [k, v[0]])));
      }
      setFormError(err instanceof ApiError ? err.message : 'Not saved. Please try again.');
    };
    const onSuccess = (saved: RecipeDetail) => router.replace(`/recipes/${saved.id}`);
    if (id === undefined) create.mutate(input, { onSuccess, onError });
    else update.mutate(input, { onSuccess, onError });
  };

  return (
    <Screen title={id === undefined ? 'New recipe' : 'Edit recipe'} backHref={id === undefined ? '/recipes' : `/recipes/${id}`}>
      {formError ? <Callout tone="danger" title="Not saved">{formError}</Callout> : null}
      <Card>
        <TextField label="Title" value={draft.title} onChangeText={(title) => {
            set({ title });
            clearError('title');
          }} error={errors.title} placeholder="e.g. Red lentil soup" />
        <TextField label="Description (optional)" value={draft.description} onChangeText={(description) => set({ description })} error={errors.description} multiline />
        <TextField label="Portions" value={draft.portions} onChangeText={(portions) => {
            set({ portions });
            clearError('defaultPortions');
          }} error={errors.defaultPortions} inputMode="numeric" unit="portions" />
        <TextField label="Tags (separated by commas)" value={draft.tags} onChangeText={(tags) => set({ tags })} error={errors.tags} placeholder="breakfast, freezer" autoCapitalize="none" />
      </Card>

      <Card>
        <Text variant="heading">Ingredients</Text>
        <Text color="textMuted">Raw weights in grams, as they go into the pot.</Text>
        {errors.ingredients ? <Callout tone="danger">{errors.ingredients}</Callout> : null}
        {draft.lines.map((line, index) => (
          <View key={line.key} style={styles.line} aria-label={`Ingredient ${index + 1}: ${line.food.name}`}>
            <Text weight="bold">
              {index + 1}. {line.food.name}
            </Text>
            {errors[`ingredients.${index}.foodId`] ? <Text color="danger">{errors[`ingredients.${index}.foodId`]}</Text> : null}
            <View style={styles.fields}>
              <View style={styles.small}>
                <TextField label={`Grams of ${line.food.name}`} value={line.grams} onChangeText={(grams) => {
                    setLine(line.key, { grams });
                    clearError(`ingredients.${index}.grams`);
                  }} error={errors[`ingredients.${index}.grams`]} inputMode="decimal" unit="g" />
              </View>
              <View style={styles.small}>
                <TextField label="Household measure (optional)" value={line.measureLabel} onChangeText={(measureLabel) => setLine(line.key, { measureLabel })} error={errors[`ingredients.${index}.measureLabel`]} placeholder="1 cup" />
              </View>
              <View style={styles.small}>
                <TextField label="Note (optional)" value={line.note} onChangeText={(note) => setLine(line.key, { note })} error={errors[`ingredients.${index}.note`]} placeholder="grated" />
              </View>
            </View>
            {line.measures.length ? (
              <View style={styles.row} role="group" aria-label={`Household measures for ${line.food.name}`}>
                {line.measures.slice(0, 4).map((m) => (
                  <Button key={m.label} variant="secondary" label={`${m.label} = ${showGrams(m.grams)}`} onPress={() => setLine(line.key, { grams: String(m.grams), measureLabel: m.label })} />
                ))}
              </View>
            ) : null}
            <View style={styles.row}>
              <Button variant="quiet" label="Move up" disabled={index === 0} onPress={() => move(index, -1)} />
              <Button variant="quiet" label="Move down" disabled={index === draft.lines.length - 1} onPress={() => move(index, 1)} />
              <Button variant="quiet" label={`Remove ${line.food.name}`} onPress={() => set({ lines: draft.lines.filter((l) => l.key !== line.key) })} />
            </View>
          </View>
        ))}
        <FoodSearch
          onPick={(food) => {
            const key = nextKey++;
            clearError('ingredients');
            setDraft((d) => ({ ...d, lines: [...d.lines, { key, food, grams: '', measureLabel: '', note: '', measures: [] }] }));
            apiFetch<{ food: Food }>(`/foods/${food.id}`)
              .then(({ food: full }) => setDraft((d) => ({ ...d, lines: d.lines.map((l) => (l.key === key ? { ...l, measures: full?.measures ?? [] } : l)) })))
              .catch(() => undefined);
          }}
        />
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
        <TextField
          label="Method (one step per line)"
          value={draft.steps}
          onChangeText={(steps) => set({ steps })}
          error={errors.methodSteps ?? Object.entries(errors).find(([k]) => k.startsWith('methodSteps.'))?.[1]}
          multiline
          numberOfLines={6}
        />
      </Card>

      <Card>
        <Text variant="heading">Who can see it</Text>
        <View style={styles.row} role="radiogroup" aria-label="Who can see it">
          {(['private', 'shared', 'public'] as const).map((v) => (
            <Button key={v} role="radio" aria-checked={draft.visibility === v} variant={draft.visibility === v ? 'primary' : 'secondary'} label={VISIBILITY_WORDS[v]} onPress={() => set({ visibility: v })} />
          ))}
        </View>
        {draft.visibility === 'private' && id !== undefined ? (
          <Text variant="caption" color="textMuted">
            Saving as “only you” stops sharing with everyone it was shared with.
          </Text>
        ) : null}
      </Card>

      <Button size="lg" label={id === undefined ? 'Save recipe' : 'Save changes'} loading={saving} onPress={submit} />
    </Screen>
  );
}

const styles = StyleSheet.create({
  line: { gap: 6, paddingBottom: 12 },
  fields: { flexDirection: 'row', flexWrap: 'wrap', gap: 12 },
  small: { flexGrow: 1, flexBasis: 160 },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: 8 },
});
