import { zodResolver } from '@hookform/resolvers/zod';
import { useFieldArray, useForm, type UseFormReturn } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';
import { dayKindInputSchema, type DayKindFormValues, type DayKindInput } from '../../shared/schemas/profile-settings';
import { useLayout, useTheme } from '../theme/use-theme';
import { Button } from '../ui/button';
import { Callout } from '../ui/callout';
import { Card } from '../ui/card';
import { FormTextField } from '../ui/form-text-field';
import { Text } from '../ui/text';
import { FormChoiceGroup } from '../ui/form-choice-group';

export type DayKindForm = UseFormReturn<DayKindFormValues, unknown, DayKindInput>;

/** Day kind editor: name, default, planned long-acting dose and the times of day with their ratios. */
export function DayKindForm({
  defaultValues,
  onSubmit,
  submitting,
  formError,
  submitLabel,
}: {
  defaultValues: DayKindFormValues;
  onSubmit: (values: DayKindInput, form: DayKindForm) => void;
  submitting: boolean;
  formError?: string;
  submitLabel: string;
}) {
  const form = useForm<DayKindFormValues, unknown, DayKindInput>({ resolver: zodResolver(dayKindInputSchema), defaultValues });
  const timesOfDay = useFieldArray({ control: form.control, name: 'timesOfDay' });
  const { isWide } = useLayout();
  const t = useTheme();
  const unit = defaultValues.glucoseUnit === 'mmol_l' ? 'mmol/L' : 'mg/dL';
  const submit = form.handleSubmit((values) => onSubmit(values, form));
  const timesOfDayError = form.formState.errors.timesOfDay?.root?.message ?? form.formState.errors.timesOfDay?.message;

  return (
    <View style={styles.stack}>
      {formError ? <Callout tone="danger" title="Not saved">{formError}</Callout> : null}
      <Card>
        <FormTextField control={form.control} name="name" label="Name of this kind of day" placeholder="e.g. Rest, Long ride" />
        <FormChoiceGroup
          control={form.control}
          name="isDefault"
          label="Use on days with no other kind set"
          choices={[{ value: true, label: 'Yes, the default' }, { value: false, label: 'No' }]}
        />
        <FormTextField
          control={form.control}
          name="longActingUnits"
          label="Planned long-acting dose (optional)"
          unit="units"
          inputMode="decimal"
          hint="As your diabetes team prescribed it. Recorded for the log; Carbwright never suggests it."
        />
      </Card>
      <Card>
        <Text variant="heading">Times of day</Text>
        <Text color="textMuted">
          The times of day must cover the whole day, from 00:00 to 24:00, in order, without gaps or overlaps. Ratio: grams of
          carbohydrate per unit. Correction factor: how far 1 unit lowers glucose, in {unit}.
        </Text>
        {timesOfDayError ? (
          <Text color="danger" role="alert">
            {timesOfDayError}
          </Text>
        ) : null}
        {timesOfDay.fields.map((f, i) => (
          <View key={f.id} style={[styles.timeOfDay, { borderColor: t.colors.border }, isWide && styles.timeOfDayWide]} aria-label={`Time of day ${i + 1}`}>
            {isWide ? null : <Text weight="bold">Time of day {i + 1}</Text>}
            <View style={[styles.fields, isWide && styles.fieldsWide]}>
              <View style={styles.field}>
                <FormTextField control={form.control} name={`timesOfDay.${i}.from`} label={`Time of day ${i + 1} from`} placeholder="00:00" />
              </View>
              <View style={styles.field}>
                <FormTextField control={form.control} name={`timesOfDay.${i}.to`} label={`Time of day ${i + 1} to`} placeholder="24:00" />
              </View>
              <View style={styles.field}>
                <FormTextField control={form.control} name={`timesOfDay.${i}.carbRatio`} label={`Time of day ${i + 1} ratio`} unit="g per unit" inputMode="decimal" style={styles.input} />
              </View>
              <View style={styles.field}>
                <FormTextField
                  control={form.control}
                  name={`timesOfDay.${i}.correctionFactor`}
                  label={`Time of day ${i + 1} correction factor`}
                  unit={`${unit} per unit`}
                  inputMode="decimal"
                  style={styles.input}
                />
              </View>
            </View>
            {timesOfDay.fields.length > 1 ? <Button variant="quiet" label={`Remove time of day ${i + 1}`} onPress={() => timesOfDay.remove(i)} /> : null}
          </View>
        ))}
        <View style={styles.row}>
          <Button
            variant="secondary"
            label="Add a time of day"
            onPress={() => {
              const last = form.getValues(`timesOfDay.${timesOfDay.fields.length - 1}`);
              timesOfDay.append({ from: last && last.to !== '24:00' ? last.to : '', to: '24:00', carbRatio: '', correctionFactor: '' });
            }}
          />
        </View>
      </Card>
      <Button label={submitLabel} size="lg" loading={submitting} onPress={submit} />
    </View>
  );
}

const styles = StyleSheet.create({
  stack: { gap: 16 },
  timeOfDay: { borderTopWidth: 1, paddingTop: 12, gap: 8 },
  timeOfDayWide: { flexDirection: 'row', alignItems: 'flex-end', gap: 12 },
  fields: { gap: 10 },
  fieldsWide: { flexDirection: 'row', flex: 1, gap: 12 },
  field: { flex: 1, minWidth: 120 },
  row: { flexDirection: 'row', gap: 12 },
  input: { minWidth: 0 },
});
