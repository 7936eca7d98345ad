import { router } from 'expo-router';
import { useEffect, useMemo, useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { defaultUseBy, regionForLocale } from '../../shared/compute/use-by';
import type { RecipeDetail } from '../../shared/schemas/recipe';
import { useActiveProfile } from '../api/auth';
import { ApiError } from '../api/client';
import { Button } from '../ui/button';
import { Screen } from '../ui/screen';
import { ErrorState, LoadingState } from '../ui/states';
import { Text } from '../ui/text';
import { TextField } from '../ui/text-field';
import { CookedWeightStep } from './cooked-weight-step';
import { num, previewBatch, stepOfField, toCreateInput, type CookState } from './cook-state';
import { localToday } from './kitchen-format';
import { useCreateBatch } from '../api/batches';
import { useContainers } from '../api/containers';
import { useRecipe } from '../api/recipes';
import { SplitStep } from './split-step';
import { StorageStep } from './storage-step';
import { WeighingStep } from './weighing-step';

type Step = 'weigh' | 'cooked' | 'split' | 'store';
const STEPS: { key: Step; label: string }[] = [
  { key: 'weigh', label: '1 Weigh' },
  { key: 'cooked', label: '2 Pot' },
  { key: 'split', label: '3 Split' },
  { key: 'store', label: '4 Store' },
];

function initialState(recipe: RecipeDetail, factor: number): CookState {
  const today = localToday();
  const region = regionForLocale(typeof navigator === 'undefined' ? undefined : navigator.language);
  return {
    lines: recipe.ingredients.map((i) => ({
      foodId: i.foodId,
      foodName: i.food.name,
      per100g: i.food.per100g,
      plannedGrams: i.grams * factor,
      reading: '',
      omitted: false,
      swappedFrom: null,
    })),
    pot: { containerId: null, tare: '', gross: '' },
    splitMode: 'weighed',
    count: String(recipe.defaultPortions),
    jars: [{ containerId: null, tare: '', gross: '' }],
    storage: 'fridge',
    region,
    cookedOn: today,
    useBy: defaultUseBy(today, 'fridge', region).useBy,
  };
}

/** Cooking a batch from a recipe: weighing checklist, cooked pot, split, storage; saved in one go. */
export function CookBatchScreen({ recipeId }: { recipeId: number }) {
  const { profile } = useActiveProfile();
  const recipe = useRecipe(recipeId, { profileId: profile?.id }, !!profile);
  const containers = useContainers(profile?.id);
  const create = useCreateBatch(profile?.id);
  const [factorText, setFactorText] = useState('1');
  const [state, setState] = useState<CookState | null>(null);
  const [step, setStep] = useState<Step>('weigh');
  const [index, setIndex] = useState(0);
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [formError, setFormError] = useState<string>();
  const factor = num(factorText);
  const started = state != null && state.lines.some((l) => l.reading !== '' || l.omitted);

  useEffect(() => {
    if (recipe.data && !started && factor != null && factor > 0) setState(initialState(recipe.data, factor));
    // Re-plan only while nothing has been weighed yet.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [recipe.data, factor]);

  const basis = profile?.carbBasis ?? 'available';
  const unit = profile?.carbUnit ?? 'g';
  const batch = useMemo(() => (state ? previewBatch(state, basis) : null), [state, basis]);

  if (recipe.isPending || !profile) return <LoadingState />;
  if (recipe.isError) return <ErrorState error={recipe.error} onRetry={recipe.refetch} />;
  if (!state) return <LoadingState />;

  const patch = (p: Partial<CookState>) => setState({ ...state, ...p });
  const all = containers.data ?? [];
  const containsRice = state.lines.some((l) => !l.omitted && /\brice\b/i.test(l.foodName));

  const save = () => {
    setFormError(undefined);
    setErrors({});
    create.mutate(toCreateInput(recipeId, factor ?? 1, state), {
      onSuccess: (saved) => router.replace(`/kitchen/batches/${saved.id}`),
      onError: (error) => {
        if (error instanceof ApiError && error.fieldErrors) {
          const flat = Object.fromEntries(Object.entries(error.fieldErrors).map(([k, v]) => [k, v[0]]));
          setErrors(flat);
          const first = Object.keys(flat)[0];
          setFormError(Object.values(flat).join(' '));
          if (first) {
            setStep(stepOfField(first));
            const line = /^ingredients\.(\d+)/.exec(first);
            if (line) setIndex(Number(line[1]));
          }
        } else setFormError(error instanceof Error ? error.message : 'Saving failed. Please try again.');
      },
    });
  };

  const lineError = errors[`ingredients.${index}.actualGrams`] ?? errors[`ingredients.${index}.foodId`];
  return (
    <Screen title={`Cook: ${recipe.data.title}`} subtitle="Weigh as you go; the numbers come from what you weighed." backHref="/kitchen">
      <View style={styles.steps} role="tablist" aria-label="Steps">
        {STEPS.map((s) => (
          <Text key={s.key} role="tab" aria-selected={s.key === step} variant="label" color={s.key === step ? 'primary' : 'textMuted'} weight={s.key === step ? 'bold' : 'regular'}>
            {s.key === step ? '● ' : ''}
            {s.label}
          </Text>
        ))}
      </View>
      {step === 'weigh' && !started ? (
        <View style={styles.scale}>
          <TextField label="Scale the recipe" unit="×" keyboardType="decimal-pad" value={factorText} onChangeText={setFactorText} hint="1 = as written; 2 = double. Set this before weighing." />
          <Button variant="quiet" label="Kitchen" onPress={() => router.replace('/kitchen')} />
        </View>
      ) : null}
      {step === 'weigh' ? (
        <WeighingStep
          lines={state.lines}
          index={index}
          onIndex={setIndex}
          onChange={(i, line) => patch({ lines: state.lines.map((l, k) => (k === i ? line : l)) })}
          onDone={() => setStep('cooked')}
          error={lineError}
        />
      ) : null}
      {step === 'cooked' ? (
        <CookedWeightStep
          pot={state.pot}
          pots={all.filter((c) => c.kind === 'pot')}
          onChange={(pot) => patch({ pot })}
          batch={batch}
          unit={unit}
          errors={errors}
          onBack={() => setStep('weigh')}
          onDone={() => setStep('split')}
        />
      ) : null}
      {step === 'split' && batch ? (
        <SplitStep
          state={state}
          containers={all.filter((c) => c.kind === 'container')}
          batch={batch}
          unit={unit}
          errors={errors}
          onChange={patch}
          onBack={() => setStep('cooked')}
          onDone={() => setStep('store')}
        />
      ) : null}
      {step === 'store' ? (
        <StorageStep
          state={state}
          containsRice={containsRice}
          errors={errors}
          formError={formError}
          saving={create.isPending}
          onChange={patch}
          onBack={() => setStep('split')}
          onSave={save}
        />
      ) : null}
    </Screen>
  );
}

const styles = StyleSheet.create({
  steps: { flexDirection: 'row', gap: 16, flexWrap: 'wrap' },
  scale: { flexDirection: 'row', alignItems: 'flex-end', gap: 8 },
});
