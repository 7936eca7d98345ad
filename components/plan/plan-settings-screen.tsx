import { zodResolver } from '@hookform/resolvers/zod';
import { backToPlan } from './back-to-plan';
import { useState } from 'react';
import { useFieldArray, useForm, type FieldPath } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';
import { planSettingsInputSchema, WEEKDAY_NAMES, type PlanSettings, type PlanSettingsFormValues, type PlanSettingsInput } from '../../shared/schemas/plan';
import { useActiveProfile } from '../api/auth';
import { usePlanSettings, useSavePlanSettings } from '../api/plan';
import { useDayKinds } from '../api/profile-settings';
import { Button } from '../ui/button';
import { Callout } from '../ui/callout';
import { Card } from '../ui/card';
import { applyServerErrors } from '../ui/form-errors';
import { FormChoiceGroup } from '../ui/form-choice-group';
import { FormTextField } from '../ui/form-text-field';
import { Screen } from '../ui/screen';
import { ErrorState, LoadingState } from '../ui/states';
import { Text } from '../ui/text';

/** Suggested meals for a new plan; the person renames, retimes or removes them. */
const STARTER_MEALS = [
  { name: 'Breakfast', time: '07:30' },
  { name: 'Lunch', time: '12:30' },
  { name: 'Dinner', time: '18:30' },
];

function toForm(s: PlanSettings): PlanSettingsFormValues {
  return { weekStart: s.weekStart, pattern: s.pattern.map((p) => ({ ...p, dayKindId: p.dayKindId ?? 0 })), mealNames: s.mealNames.length ? s.mealNames : STARTER_MEALS };
}

/** The weekly pattern (which weekday is which kind of day), the week start and the named meals with their usual times. */
export function PlanSettingsScreen() {
  const { profile } = useActiveProfile();
  const settings = usePlanSettings(profile?.id);
  const kinds = useDayKinds(profile?.id);
  if (!profile || settings.isPending || kinds.isPending) return <Screen title="Weekly pattern and meals" backHref="/plan"><LoadingState /></Screen>;
  if (settings.isError) return <Screen title="Weekly pattern and meals" backHref="/plan"><ErrorState error={settings.error} onRetry={() => void settings.refetch()} /></Screen>;
  if (kinds.isError) return <Screen title="Weekly pattern and meals" backHref="/plan"><ErrorState error={kinds.error} onRetry={() => void kinds.refetch()} /></Screen>;
  return (
    <Screen title="Weekly pattern and meals" subtitle="Which days are which kind, and the meals you plan." backHref="/plan">
      <PlanSettingsForm profileId={profile.id} defaultValues={toForm(settings.data)} kinds={kinds.data.map((k) => ({ value: k.id, label: k.name }))} />
    </Screen>
  );
}

function PlanSettingsForm({ profileId, defaultValues, kinds }: { profileId: number; defaultValues: PlanSettingsFormValues; kinds: { value: number; label: string }[] }) {
  const form = useForm<PlanSettingsFormValues, unknown, PlanSettingsInput>({ resolver: zodResolver(planSettingsInputSchema), defaultValues });
  const meals = useFieldArray({ control: form.control, name: 'mealNames' });
  const save = useSavePlanSettings(profileId);
  const [formError, setFormError] = useState<string>();
  const fieldOf = (path: string) => path as FieldPath<PlanSettingsFormValues>;
  const submit = form.handleSubmit((values) =>
    save.mutate(values, {
      onSuccess: backToPlan,
      onError: (err) => setFormError(applyServerErrors(err, form.setError, fieldOf)),
    }),
  );
  const kindChoices = [{ value: 0, label: 'The default kind' }, ...kinds];

  return (
    <View style={styles.stack}>
      {formError ? <Callout tone="danger" title="Not saved">{formError}</Callout> : null}
      <Card>
        <Text variant="heading">The week starts on</Text>
        <FormChoiceGroup control={form.control} name="weekStart" label="First day of the week" choices={[{ value: 1, label: 'Monday' }, { value: 7, label: 'Sunday' }, { value: 6, label: 'Saturday' }]} />
      </Card>
      <Card>
        <Text variant="heading">Weekly pattern</Text>
        <Text color="textMuted">The kind of day each weekday usually is. A date you set on Today or in settings still wins.</Text>
        {kinds.length === 0 ? <Callout tone="caution" title="No kinds of day yet">Set up your kinds of day in settings first.</Callout> : null}
        {WEEKDAY_NAMES.map((name, i) => (
          <FormChoiceGroup key={name} control={form.control} name={`pattern.${i}.dayKindId`} label={name} choices={kindChoices} />
        ))}
      </Card>
      <Card>
        <Text variant="heading">Meals</Text>
        <Text color="textMuted">Your own meals with their usual clock time; the time picks the kind of day’s time of day (and its ratio).</Text>
        {meals.fields.map((f, i) => (
          <View key={f.id} style={styles.mealRow}>
            <FormTextField control={form.control} name={`mealNames.${i}.name`} label="Meal name" />
            <FormTextField control={form.control} name={`mealNames.${i}.time`} label="Usual time" hint="24-hour, e.g. 07:30" />
            <Button variant="quiet" label={`Remove meal ${i + 1}`} onPress={() => meals.remove(i)} />
          </View>
        ))}
        <Button variant="secondary" label="Add a meal" onPress={() => meals.append({ name: '', time: '' })} />
      </Card>
      <Button label="Save" size="lg" loading={save.isPending} onPress={() => void submit()} />
    </View>
  );
}

const styles = StyleSheet.create({
  stack: { gap: 16 },
  mealRow: { gap: 4 },
});
