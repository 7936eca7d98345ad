import { zodResolver } from '@hookform/resolvers/zod';
import { useMemo, useState } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';
import { formatGlucose, glucoseToMmol } from '../../shared/compute/units';
import type { LogEntry } from '../../shared/schemas/logbook';
import type { GlucoseUnit } from '../../shared/schemas/units';
import { useCreateLogEntry } from '../api/logbook';
import { formatInsulinUnits } from '../dose/insulin-format';
import { Button } from '../ui/button';
import { Callout } from '../ui/callout';
import { applyServerErrors } from '../ui/form-errors';
import { FormChoiceGroup } from '../ui/form-choice-group';
import { FormTextField } from '../ui/form-text-field';
import { Text } from '../ui/text';
import { addEntryFormSchema, INTENSITY_CHOICES, type AddEntryValues } from './entry-requests';

const FIELDS = ['glucose', 'units', 'intensity', 'durationMinutes', 'carbsGrams', 'note', 'whenValue'] as const;
const EMPTY: AddEntryValues = { kind: 'reading', glucose: '', units: '', intensity: 'moderate', durationMinutes: '', carbsGrams: '', note: '', when: 'now', whenValue: '' };

const KINDS = [
  { value: 'reading', label: 'Glucose reading' },
  { value: 'rapid_dose', label: 'Rapid-acting dose' },
  { value: 'long_dose', label: 'Long-acting dose' },
  { value: 'exercise', label: 'Exercise' },
  { value: 'meal', label: 'Carbohydrate (typed)' },
] as const;

/** What was saved, in a line: "Long-acting dose 12 units at 07:30". */
function savedText(entry: LogEntry, unit: GlucoseUnit): string {
  const what = entry.reading
    ? formatGlucose(glucoseToMmol(entry.reading.glucose, unit), unit)
    : entry.dose
      ? formatInsulinUnits(entry.dose.units)
      : entry.exercise
        ? `${entry.exercise.intensity}, ${entry.exercise.durationMinutes} min`
        : (entry.meal?.title ?? '');
  return `Saved: ${KINDS.find((k) => k.value === entry.kind)?.label ?? 'Entry'} ${what} at ${entry.localTime}.`;
}

type Props = {
  profileId: number;
  glucoseUnit: GlucoseUnit;
  timeZone: string;
  /** The day kind's planned long-acting units for today, shown beside the long-acting field (null: none planned). */
  plannedLongUnits: number | null;
  dayKindName?: string | null;
};

/** One entry of any kind: what, the value(s), when (now, minutes ago or a clock time today), save. */
export function AddEntryForm({ profileId, glucoseUnit, timeZone, plannedLongUnits, dayKindName }: Props) {
  const create = useCreateLogEntry(profileId);
  const schema = useMemo(() => addEntryFormSchema(glucoseUnit, timeZone), [glucoseUnit, timeZone]);
  const form = useForm({ resolver: zodResolver(schema), defaultValues: EMPTY });
  const [kind, when] = useWatch({ control: form.control, name: ['kind', 'when'] });
  const [formError, setFormError] = useState<string>();
  const [saved, setSaved] = useState<string>();

  const save = form.handleSubmit((input) => {
    setFormError(undefined);
    setSaved(undefined);
    create.mutate(input, {
      onSuccess: (group) => {
        setSaved(group.entries[0] ? savedText(group.entries[0], glucoseUnit) : 'Saved.');
        form.reset({ ...EMPTY, kind: input.kind });
      },
      onError: (e) => setFormError(applyServerErrors(e, form.setError, FIELDS)),
    });
  });

  const plannedHint =
    plannedLongUnits == null
      ? `No long-acting dose is planned for ${dayKindName ?? 'today'}.`
      : `Planned for ${dayKindName ?? 'today'}: ${formatInsulinUnits(plannedLongUnits)}.`;

  return (
    <View style={styles.form}>
      <FormChoiceGroup control={form.control} name="kind" label="What" choices={KINDS} onChosen={() => setSaved(undefined)} />
      {kind === 'reading' ? (
        <FormTextField control={form.control} name="glucose" label="Glucose" unit={glucoseUnit === 'mmol_l' ? 'mmol/L' : 'mg/dL'} keyboardType="decimal-pad" />
      ) : null}
      {kind === 'rapid_dose' ? <FormTextField control={form.control} name="units" label="Rapid-acting insulin" unit="units" keyboardType="decimal-pad" /> : null}
      {kind === 'long_dose' ? (
        <FormTextField control={form.control} name="units" label="Long-acting insulin" unit="units" keyboardType="decimal-pad" hint={plannedHint} />
      ) : null}
      {kind === 'exercise' ? (
        <>
          <FormChoiceGroup control={form.control} name="intensity" label="Intensity" choices={INTENSITY_CHOICES} />
          <FormTextField control={form.control} name="durationMinutes" label="How long" unit="min" keyboardType="number-pad" />
        </>
      ) : null}
      {kind === 'meal' ? <FormTextField control={form.control} name="carbsGrams" label="Carbohydrate" unit="g" keyboardType="decimal-pad" /> : null}
      {kind !== 'reading' ? (
        <FormTextField control={form.control} name="note" label={kind === 'meal' ? 'What it was' : 'Note (optional)'} />
      ) : null}
      <FormChoiceGroup
        control={form.control}
        name="when"
        label="When"
        choices={[
          { value: 'now', label: 'Now' },
          { value: 'ago', label: 'Minutes ago' },
          { value: 'clock', label: 'Clock time today' },
        ]}
      />
      {when === 'ago' ? <FormTextField control={form.control} name="whenValue" label="How many minutes ago" unit="min" keyboardType="number-pad" /> : null}
      {when === 'clock' ? <FormTextField control={form.control} name="whenValue" label="Clock time" placeholder="07:30" hint="In the profile's time zone." /> : null}
      {formError ? <Callout tone="danger">{formError}</Callout> : null}
      {saved ? <Callout tone="ok">{saved}</Callout> : null}
      <Button label="Save entry" loading={create.isPending} onPress={() => void save()} />
    </View>
  );
}

const styles = StyleSheet.create({ form: { gap: 12 } });
