import { zodResolver } from '@hookform/resolvers/zod';
import { backToPlan } from './back-to-plan';
import { useState } from 'react';
import { useForm, useWatch, type FieldPath } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';
import { formatCarb } from '../../shared/compute/units';
import { formatPortionCode } from '../../shared/compute/portion-code';
import { planMealInputSchema, type PlanMealFormValues, type PlanMealInput, type PlanSettings, type PlanWeek } from '../../shared/schemas/plan';
import type { BatchSummary } from '../../shared/schemas/batch';
import { useActiveProfile } from '../api/auth';
import { useBatches } from '../api/batches';
import { useCreatePlanMeal, usePlanSettings, usePlanWeek } from '../api/plan';
import { useCookableRecipes } from '../api/recipes';
import { Button } from '../ui/button';
import { Callout } from '../ui/callout';
import { Card } from '../ui/card';
import { applyServerErrors } from '../ui/form-errors';
import { FormChoiceGroup } from '../ui/form-choice-group';
import { FormTextField } from '../ui/form-text-field';
import { PlanFoodPick } from './plan-food-pick';
import { Screen } from '../ui/screen';
import { ErrorState, LoadingState } from '../ui/states';

const SOURCES = [
  { value: 'portion', label: 'A portion from the fridge or freezer' },
  { value: 'planned_cook', label: 'A portion of a planned cook' },
  { value: 'recipe', label: 'A recipe amount (grams or portions)' },
  { value: 'food', label: 'A food by grams (a pack food or one from the tables)' },
  { value: 'carb', label: 'A carbohydrate amount' },
] as const;

/** Plans a meal (or the same meal on several days in a row) on a date. */
export function PlanMealScreen({ date }: { date: string }) {
  const { profile } = useActiveProfile();
  const settings = usePlanSettings(profile?.id);
  const week = usePlanWeek(profile?.id, date);
  const batches = useBatches(profile?.id, 'available');
  const recipes = useCookableRecipes(profile?.id);
  const title = 'Plan a meal';
  const parts = [settings, week, batches, recipes] as const;
  if (!profile || parts.some((q) => q.isPending)) return <Screen title={title} backHref="/plan"><LoadingState /></Screen>;
  const failed = parts.find((q) => q.isError);
  if (failed) return <Screen title={title} backHref="/plan"><ErrorState error={failed.error} onRetry={() => void failed.refetch()} /></Screen>;
  return (
    <Screen title={title} subtitle="Pick the meal, then what it holds." backHref="/plan">
      <PlanMealForm
        profileId={profile.id}
        date={date}
        settings={settings.data!}
        week={week.data!}
        batches={batches.data!}
        recipes={(recipes.data ?? []).map((r) => ({ value: r.id, label: r.title }))}
      />
    </Screen>
  );
}

function PlanMealForm(props: { profileId: number; date: string; settings: PlanSettings; week: PlanWeek; batches: BatchSummary[]; recipes: { value: number; label: string }[] }) {
  const { profileId, date, settings, week, batches, recipes } = props;
  const form = useForm<PlanMealFormValues, unknown, PlanMealInput>({
    resolver: zodResolver(planMealInputSchema),
    defaultValues: { date, mealNameId: settings.mealNames[0]?.id ?? '', time: '', source: 'portion', portionId: null, plannedCookId: null, recipeId: null, foodId: null, grams: '', portions: '', carbGrams: '', thawOn: '', note: '', repeatDays: '1' },
  });
  const source = useWatch({ control: form.control, name: 'source' });
  const portionId = useWatch({ control: form.control, name: 'portionId' });
  const create = useCreatePlanMeal(profileId);
  const [formError, setFormError] = useState<string>();
  const placed = new Set(week.days.flatMap((d) => d.meals.map((m) => m.portionId)));
  const portionChoices = batches.flatMap((b) =>
    b.portions
      .filter((p) => p.status === 'available' && !placed.has(p.id))
      .map((p) => ({ value: p.id, label: `${b.recipeTitle} · ${formatPortionCode(p.code)} · ${formatCarb(p.carb.grams, week.unit)}`, hint: `${b.storage === 'freezer' ? 'Freezer' : 'Fridge'}, ${b.storage === 'freezer' ? 'best quality by' : 'use by'} ${b.useBy}`, frozen: b.storage === 'freezer' })),
  );
  const frozen = portionChoices.find((c) => c.value === portionId)?.frozen;
  const cooks = week.cooks.filter((c) => !c.batchId).map((c) => ({ value: c.id, label: `${c.recipeTitle} · ${c.cookOn ?? 'no date yet'} · ${c.portions} portions` }));
  const submit = form.handleSubmit((values) =>
    create.mutate(values, {
      onSuccess: backToPlan,
      onError: (err) => setFormError(applyServerErrors(err, form.setError, (path) => path as FieldPath<PlanMealFormValues>)),
    }),
  );

  if (!settings.mealNames.length) {
    return <Callout tone="caution" title="Name your meals first">Set your meals and their usual times under Weekly pattern and meals.</Callout>;
  }
  return (
    <View style={styles.stack}>
      {formError ? <Callout tone="danger" title="Not planned">{formError}</Callout> : null}
      <Card>
        <FormTextField control={form.control} name="date" label="Date" hint="YYYY-MM-DD" />
        <FormChoiceGroup control={form.control} name="mealNameId" label="Meal" choices={settings.mealNames.map((m) => ({ value: m.id, label: `${m.name} (${m.time})` }))} />
        <FormTextField control={form.control} name="time" label="Time (optional)" hint="Leave empty for the meal’s usual time." />
        <FormChoiceGroup control={form.control} name="source" label="What it holds" choices={SOURCES} />
      </Card>
      <Card>
        {source === 'portion' ? (
          portionChoices.length ? (
            <>
              <FormChoiceGroup control={form.control} name="portionId" label="Portion" choices={portionChoices} />
              {frozen ? <FormTextField control={form.control} name="thawOn" label="Thaw day (into the fridge)" hint="YYYY-MM-DD; its fridge use-by counts from this day." /> : null}
            </>
          ) : (
            <Callout tone="info" title="No portions to place">Every portion not eaten yet is already planned, or nothing is cooked yet.</Callout>
          )
        ) : null}
        {source === 'planned_cook' ? (
          cooks.length ? <FormChoiceGroup control={form.control} name="plannedCookId" label="Planned cook" choices={cooks} /> : <Callout tone="info" title="No planned cooks">Plan a cook first.</Callout>
        ) : null}
        {source === 'recipe' ? (
          <>
            <FormChoiceGroup control={form.control} name="recipeId" label="Recipe" choices={recipes} />
            <FormTextField control={form.control} name="portions" label="Portions" keyboardType="decimal-pad" hint="Or leave empty and give grams." />
            <FormTextField control={form.control} name="grams" label="Grams" unit="g" keyboardType="decimal-pad" />
          </>
        ) : null}
        {source === 'food' ? <PlanFoodPick control={form.control} basis={week.basis} unit={week.unit} /> : null}
        {source === 'carb' ? <FormTextField control={form.control} name="carbGrams" label="Carbohydrate" unit="g" keyboardType="decimal-pad" /> : null}
        <FormTextField control={form.control} name="repeatDays" label="Days in a row" keyboardType="number-pad" hint="1 to 7. A batch portion uses the batch’s next portions on the days after." />
      </Card>
      <Button label="Plan this meal" size="lg" loading={create.isPending} onPress={() => void submit()} />
    </View>
  );
}

const styles = StyleSheet.create({ stack: { gap: 16 } });
