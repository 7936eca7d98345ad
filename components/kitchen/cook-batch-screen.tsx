import { zodResolver } from '@hookform/resolvers/zod';
import { router } from 'expo-router';
import { useEffect, useMemo, useState } from 'react';
import { useForm, useWatch, type FieldErrors } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';
import { defaultUseBy, regionForLocale } from '../../shared/compute/use-by';
import type { CreateBatchParsed } from '../../shared/schemas/batch';
import type { RecipeDetail } from '../../shared/schemas/recipe';
import { useActiveProfile } from '../api/auth';
import { useCreateBatch } from '../api/batches';
import { ApiError } from '../api/client';
import { useContainers } from '../api/containers';
import { useRecipe } from '../api/recipes';
import { Button } from '../ui/button';
import { applyServerErrors } from '../ui/form-errors';
import { FormTextField } from '../ui/form-text-field';
import { Screen } from '../ui/screen';
import { ErrorState, LoadingState } from '../ui/states';
import { Text } from '../ui/text';
import { cookFieldOf, cookFormSchema, stepOfField, type CookStep } from './batch-request';
import { CookedWeightStep } from './cooked-weight-step';
import { cookFormDefaults, cookStarted, hasRice, num, plannedLines, previewBatch, type CookFormValues, type CookLine } from './cook-state';
import { localToday } from './kitchen-format';
import { SplitStep } from './split-step';
import { StorageStep } from './storage-step';
import { WeighingStep } from './weighing-step';

export type CookForm = ReturnType<typeof useForm<CookFormValues, unknown, CreateBatchParsed>>;

const STEPS: { key: CookStep; label: string }[] = [
  { key: 'weigh', label: '1 Weigh' },
  { key: 'cooked', label: '2 Pot' },
  { key: 'split', label: '3 Portion out' },
  { key: 'store', label: '4 Store' },
];

/** The first field with an error, as a dotted path ("lines.2.reading"). */
function firstError(errors: FieldErrors, prefix = ''): string | undefined {
  for (const [key, value] of Object.entries(errors)) {
    if (!value) continue;
    const path = prefix ? `${prefix}.${key}` : key;
    if (typeof value === 'object' && 'message' in value && value.message) return path;
    const inner = typeof value === 'object' ? firstError(value as FieldErrors, path) : undefined;
    if (inner) return inner;
  }
  return undefined;
}

/** Cooking a batch from a recipe: weighing checklist, cooked pot, split, storage; one form, saved in one go. */
export function CookBatchScreen({ recipeId }: { recipeId: number }) {
  const { profile } = useActiveProfile();
  const recipe = useRecipe(recipeId, { profileId: profile?.id }, !!profile);
  if (recipe.isPending || !profile) return <LoadingState />;
  if (recipe.isError) return <ErrorState error={recipe.error} onRetry={recipe.refetch} />;
  return <CookBatch recipe={recipe.data} profileId={profile.id} basis={profile.carbBasis} unit={profile.carbUnit} />;
}

type Props = { recipe: RecipeDetail; profileId: number; basis: 'available' | 'total'; unit: Parameters<typeof SplitStep>[0]['unit'] };

function CookBatch({ recipe, profileId, basis, unit }: Props) {
  const containers = useContainers(profileId);
  const create = useCreateBatch(profileId);
  const [defaults] = useState(() => cookFormDefaults(recipe, localToday(), regionForLocale(typeof navigator === 'undefined' ? undefined : navigator.language)));
  const form: CookForm = useForm<CookFormValues, unknown, CreateBatchParsed>({ resolver: zodResolver(cookFormSchema), defaultValues: defaults });
  const [step, setStep] = useState<CookStep>('weigh');
  const [index, setIndex] = useState(0);
  const [formError, setFormError] = useState<string>();
  const [factorText, lines, pot] = useWatch({ control: form.control, name: ['factor', 'lines', 'pot'] });
  const factor = num(factorText);
  const started = cookStarted(lines);

  // Re-plan from the recipe (also after it was edited elsewhere) and the scale factor, only while nothing is weighed.
  useEffect(() => {
    if (!cookStarted(form.getValues('lines')) && factor != null && factor > 0) form.setValue('lines', plannedLines(recipe, factor));
  }, [recipe, factor, form]);
  // A new cooking date, storage or advice region puts the use-by date back to the advice's default.
  useEffect(() => {
    const sub = form.watch((v, { name }) => {
      if ((name === 'cookedOn' || name === 'storage' || name === 'region') && /^\d{4}-\d{2}-\d{2}$/.test(v.cookedOn ?? '')) {
        form.setValue('useBy', defaultUseBy(v.cookedOn!, v.storage ?? 'fridge', v.region ?? 'uk', hasRice((v.lines ?? []) as CookLine[])).useBy);
      }
    });
    return () => sub.unsubscribe();
  }, [form]);

  const batch = useMemo(() => previewBatch({ lines, pot }, basis), [lines, pot, basis]);
  const all = containers.data ?? [];
  const containsRice = hasRice(lines);

  const showError = (field: string | undefined) => {
    if (!field) return;
    setStep(stepOfField(field));
    const line = /^lines\.(\d+)/.exec(field);
    if (line) setIndex(Number(line[1]));
  };
  const save = form.handleSubmit(
    (input) => {
      setFormError(undefined);
      create.mutate(input, {
        onSuccess: (saved) => router.replace(`/kitchen/batches/${saved.id}`),
        onError: (error) => {
          setFormError(applyServerErrors(error, form.setError, cookFieldOf));
          if (error instanceof ApiError) showError(cookFieldOf(Object.keys(error.fieldErrors ?? {})[0] ?? ''));
        },
      });
    },
    (errors) => showError(firstError(errors)),
  );

  return (
    <Screen title={`Cook: ${recipe.title}`} subtitle="Weigh as you go; the numbers come from what you weighed." backHref="/kitchen">
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
          <FormTextField control={form.control} name="factor" label="Scale the recipe" unit="×" keyboardType="decimal-pad" hint="1 = as written; 2 = double. Set this before weighing." />
          <Button variant="quiet" label="Kitchen" onPress={() => router.replace('/kitchen')} />
        </View>
      ) : null}
      {step === 'weigh' ? <WeighingStep form={form} index={index} onIndex={setIndex} onDone={() => setStep('cooked')} /> : null}
      {step === 'cooked' ? (
        <CookedWeightStep form={form} pots={all.filter((c) => c.kind === 'pot')} batch={batch} basis={basis} unit={unit} onBack={() => setStep('weigh')} onDone={() => setStep('split')} />
      ) : null}
      {step === 'split' && batch ? (
        <SplitStep form={form} containers={all.filter((c) => c.kind === 'container')} batch={batch} basis={basis} unit={unit} onBack={() => setStep('cooked')} onDone={() => setStep('store')} />
      ) : null}
      {step === 'store' ? (
        <StorageStep form={form} containsRice={containsRice} formError={formError} saving={create.isPending} onBack={() => setStep('split')} onSave={() => void save()} />
      ) : null}
    </Screen>
  );
}

const styles = StyleSheet.create({
  steps: { flexDirection: 'row', gap: 16, flexWrap: 'wrap' },
  scale: { flexDirection: 'row', alignItems: 'flex-end', gap: 8 },
});
