import { useFieldArray, type Control, type FieldPath, type FieldValues } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';
import { useTheme } from '../theme/use-theme';
import { Button } from '../ui/button';
import { FormGrid } from '../ui/form-grid';
import { FormTextField } from '../ui/form-text-field';
import { Text } from '../ui/text';

/** One earlier rapid-acting dose as typed: units and how many minutes ago. */
export type EarlierDoseRow = { units: string; minutesAgo: string };

/** The API accepts at most this many earlier doses (doseRequestSchema). */
export const MAX_EARLIER_DOSES = 20;
/** Minutes back a dose can be entered: a day covers every action time the settings allow (2–8 h). */
const MAX_MINUTES_AGO = 1440;

type Form = FieldValues & { earlierDoses: EarlierDoseRow[] };

/**
 * Rows with something typed, as the request's earlierDoses (takenAt = `now` minus the minutes), or the
 * field errors of rows whose minutes cannot be read. Units are checked by the shared schema afterwards.
 */
export function earlierDosesRequest(
  rows: EarlierDoseRow[],
  now: number,
): { doses: { units: string; takenAt: string; row: number }[]; errors: Record<string, string[]> } {
  const doses: { units: string; takenAt: string; row: number }[] = [];
  const errors: Record<string, string[]> = {};
  rows.forEach((r, i) => {
    if (r.units.trim() === '' && r.minutesAgo.trim() === '') return;
    const minutes = Number(r.minutesAgo.trim().replace(',', '.'));
    if (r.minutesAgo.trim() === '' || !Number.isFinite(minutes) || minutes < 0 || minutes > MAX_MINUTES_AGO) {
      errors[`earlierDoses.${i}.minutesAgo`] = [`Enter how long ago, 0 to ${MAX_MINUTES_AGO} minutes.`];
      return;
    }
    doses.push({ units: r.units, takenAt: new Date(now - minutes * 60_000).toISOString(), row: i });
  });
  return { doses, errors };
}

/** Where an error on earlierDoses.N.units / .takenAt lands, given which row each sent dose came from. */
export function earlierDoseField(path: string, rowOfDose: number[]): string | undefined {
  if (/^earlierDoses\.\d+\.minutesAgo$/.test(path)) return path;
  const m = /^earlierDoses\.(\d+)\.(units|takenAt)$/.exec(path);
  if (!m) return path.startsWith('earlierDoses') ? 'earlierDoses.0.units' : undefined;
  const row = rowOfDose[Number(m[1])] ?? Number(m[1]);
  return `earlierDoses.${row}.${m[2] === 'units' ? 'units' : 'minutesAgo'}`;
}

/** Add and remove earlier rapid-acting doses; each row is units and minutes ago. */
export function EarlierDosesFields<T extends Form, TOut extends FieldValues = T>({ control }: { control: Control<T, unknown, TOut> }) {
  const t = useTheme();
  const c = control as unknown as Control<Form>;
  const { fields, append, remove } = useFieldArray({ control: c, name: 'earlierDoses' });
  return (
    <View style={styles.stack} role="group" aria-label="Rapid insulin taken recently">
      <Text weight="bold">Rapid insulin taken recently</Text>
      <Text color="textMuted">Add each dose still within your action time; leave none if there were none.</Text>
      {fields.map((f, i) => (
        <View key={f.id} style={[styles.dose, { borderColor: t.colors.border }]}>
          <FormGrid minCell={140}>
            <FormTextField
                control={c}
                name={`earlierDoses.${i}.units` as FieldPath<Form>}
                style={styles.input}
                label={`Earlier dose ${i + 1}`}
                unit="units"
                inputMode="decimal"
              />
            <FormTextField
                control={c}
                name={`earlierDoses.${i}.minutesAgo` as FieldPath<Form>}
                style={styles.input}
                label={`Dose ${i + 1} taken`}
                unit="min ago"
                inputMode="numeric"
              />
          </FormGrid>
          <View style={styles.remove}>
            <Button variant="quiet" label={`Remove dose ${i + 1}`} aria-label={`Remove earlier dose ${i + 1}`} onPress={() => remove(i)} />
          </View>
        </View>
      ))}
      {fields.length < MAX_EARLIER_DOSES ? (
        <Button
          variant="secondary"
          label={fields.length ? 'Add another earlier dose' : 'Add an earlier dose'}
          onPress={() => append({ units: '', minutesAgo: '' } as never)}
        />
      ) : (
        <Text color="textMuted">At most {MAX_EARLIER_DOSES} earlier doses.</Text>
      )}
    </View>
  );
}

const styles = StyleSheet.create({
  stack: { gap: 8 },
  input: { minWidth: 0 },
  dose: { gap: 4, paddingBottom: 8, borderBottomWidth: 1 },
  remove: { alignSelf: 'flex-start' },
});
