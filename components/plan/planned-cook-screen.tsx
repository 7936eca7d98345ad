import { zodResolver } from '@hookform/resolvers/zod';
import { backToPlan } from './back-to-plan';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';
import { plannedCookInputSchema, type PlannedCookFormValues, type PlannedCookInput } from '../../shared/schemas/plan';
import { useActiveProfile } from '../api/auth';
import { useCreatePlannedCook } from '../api/plan';
import { useCookableRecipes } from '../api/recipes';
import { Button } from '../ui/button';
import { Callout } from '../ui/callout';
import { Card } from '../ui/card';
import { applyServerErrors } from '../ui/form-errors';
import { FormChoiceGroup } from '../ui/form-choice-group';
import { FormTextField } from '../ui/form-text-field';
import { Screen } from '../ui/screen';
import { ErrorState, LoadingState } from '../ui/states';

const FIELDS = ['recipeId', 'cookOn', 'portions'] as const;

/** Plans a cook: a recipe, a day (or none yet) and how many portions; its portions can then be placed in meals. */
export function PlannedCookScreen({ date }: { date: string }) {
  const { profile } = useActiveProfile();
  const recipes = useCookableRecipes(profile?.id);
  if (!profile || recipes.isPending) return <Screen title="Plan a cook" backHref="/plan"><LoadingState /></Screen>;
  if (recipes.isError) return <Screen title="Plan a cook" backHref="/plan"><ErrorState error={recipes.error} onRetry={() => void recipes.refetch()} /></Screen>;
  return (
    <Screen title="Plan a cook" subtitle="A recipe to cook this week; place its portions in meals before it is cooked." backHref="/plan">
      <PlannedCookForm profileId={profile.id} date={date} recipes={recipes.data.map((r) => ({ value: r.id, label: r.title }))} />
    </Screen>
  );
}

function PlannedCookForm({ profileId, date, recipes }: { profileId: number; date: string; recipes: { value: number; label: string }[] }) {
  const form = useForm<PlannedCookFormValues, unknown, PlannedCookInput>({ resolver: zodResolver(plannedCookInputSchema), defaultValues: { recipeId: '', cookOn: date, portions: '4' } });
  const create = useCreatePlannedCook(profileId);
  const [formError, setFormError] = useState<string>();
  const submit = form.handleSubmit((values) =>
    create.mutate(values, { onSuccess: backToPlan, onError: (err) => setFormError(applyServerErrors(err, form.setError, FIELDS)) }),
  );
  if (!recipes.length) return <Callout tone="info" title="No recipes yet">Add a recipe to plan a cook.</Callout>;
  return (
    <View style={styles.stack}>
      {formError ? <Callout tone="danger" title="Not planned">{formError}</Callout> : null}
      <Card>
        <FormChoiceGroup control={form.control} name="recipeId" label="Recipe" choices={recipes} />
        <FormTextField control={form.control} name="cookOn" label="Cook on" hint="YYYY-MM-DD, or leave empty to decide later." />
        <FormTextField control={form.control} name="portions" label="Portions" keyboardType="number-pad" />
      </Card>
      <Button label="Plan this cook" size="lg" loading={create.isPending} onPress={() => void submit()} />
    </View>
  );
}

const styles = StyleSheet.create({ stack: { gap: 16 } });
