import { zodResolver } from '@hookform/resolvers/zod';
import { useMemo, useState } from 'react';
import { useForm } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';
import type { LogEntry } from '../../shared/schemas/logbook';
import type { CarbBasis, GlucoseUnit } from '../../shared/schemas/units';
import { useUpdateLogEntry } from '../api/logbook';
import { Button } from '../ui/button';
import { Callout } from '../ui/callout';
import { applyServerErrors } from '../ui/form-errors';
import { FormChoiceGroup } from '../ui/form-choice-group';
import { FormTextField } from '../ui/form-text-field';
import { editEntryFormSchema, INTENSITY_CHOICES, type EditEntryValues } from './entry-requests';

const FIELDS = ['glucose', 'units', 'intensity', 'durationMinutes', 'carbsGrams', 'note', 'time'] as const;
const text = (n: number | null | undefined) => (n == null ? '' : String(n));

/** The form's starting values: the entry as it is now (glucose in the profile's unit, carbohydrate in its basis). */
export function editValuesOf(entry: LogEntry, basis: CarbBasis): EditEntryValues {
  return {
    time: entry.localTime,
    glucose: text(entry.reading?.glucose),
    units: text(entry.dose?.units),
    intensity: entry.exercise?.intensity ?? 'moderate',
    durationMinutes: text(entry.exercise?.durationMinutes),
    carbsGrams: text(basis === 'available' ? entry.meal?.carbAvailableG : entry.meal?.carbTotalG),
    note: entry.note ?? '',
  };
}

type Props = { profileId: number; entry: LogEntry; glucoseUnit: GlucoseUnit; carbBasis: CarbBasis; onDone: () => void };

/** Correct an entry's own fields and its time; the version before is kept and shown as changed. */
export function EditEntryForm({ profileId, entry, glucoseUnit, carbBasis, onDone }: Props) {
  const update = useUpdateLogEntry(profileId);
  const schema = useMemo(() => editEntryFormSchema(entry, glucoseUnit), [entry, glucoseUnit]);
  const form = useForm({ resolver: zodResolver(schema), defaultValues: editValuesOf(entry, carbBasis) });
  const [formError, setFormError] = useState<string>();
  const isDose = entry.kind === 'rapid_dose' || entry.kind === 'long_dose';

  const save = form.handleSubmit((input) => {
    setFormError(undefined);
    update.mutate({ id: entry.id, input }, { onSuccess: onDone, onError: (e) => setFormError(applyServerErrors(e, form.setError, FIELDS)) });
  });

  return (
    <View style={styles.form} aria-label={`Correct this ${entry.kind.replace('_', ' ')}`}>
      <FormTextField control={form.control} name="time" label="Time" hint={`HH:MM on ${entry.localDate} (${entry.timeZone}).`} />
      {entry.kind === 'reading' ? (
        <FormTextField control={form.control} name="glucose" label="Glucose" unit={glucoseUnit === 'mmol_l' ? 'mmol/L' : 'mg/dL'} keyboardType="decimal-pad" />
      ) : null}
      {isDose ? <FormTextField control={form.control} name="units" label="Insulin" unit="units" keyboardType="decimal-pad" /> : null}
      {entry.kind === 'exercise' ? (
        <>
          <FormChoiceGroup control={form.control} name="intensity" label="Intensity" choices={INTENSITY_CHOICES} />
          <FormTextField control={form.control} name="durationMinutes" label="How long" unit="min" keyboardType="number-pad" />
        </>
      ) : null}
      {entry.meal?.source === 'typed' ? <FormTextField control={form.control} name="carbsGrams" label="Carbohydrate" unit="g" keyboardType="decimal-pad" /> : null}
      {isDose || entry.kind === 'exercise' ? <FormTextField control={form.control} name="note" label="Note (optional)" /> : null}
      {formError ? <Callout tone="danger">{formError}</Callout> : null}
      <View style={styles.row}>
        <Button label="Save correction" loading={update.isPending} onPress={() => void save()} />
        <Button variant="quiet" label="Cancel" onPress={onDone} />
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  form: { gap: 10 },
  row: { flexDirection: 'row', gap: 8, flexWrap: 'wrap' },
});
