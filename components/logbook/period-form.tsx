import { zodResolver } from '@hookform/resolvers/zod';
import { useForm, type Control, type FieldPath } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';
import { logPeriodQuerySchema, type LogPeriodQuery } from '../../shared/schemas/logbook-read';
import { Button } from '../ui/button';
import { FormTextField } from '../ui/form-text-field';

/** The from and to fields of any form that holds a period of local dates. */
export function PeriodFields<T extends LogPeriodQuery>({ control }: { control: Control<T> }) {
  return (
    <>
      <View style={styles.field}>
        <FormTextField control={control} name={'from' as FieldPath<T>} label="From" hint="YYYY-MM-DD" autoCapitalize="none" />
      </View>
      <View style={styles.field}>
        <FormTextField control={control} name={'to' as FieldPath<T>} label="To" hint="YYYY-MM-DD" autoCapitalize="none" />
      </View>
    </>
  );
}

/** A period of local dates (from, to), applied with one button. */
export function PeriodForm({ values, onApply }: { values: LogPeriodQuery; onApply: (values: LogPeriodQuery) => void }) {
  const form = useForm<LogPeriodQuery>({ resolver: zodResolver(logPeriodQuerySchema), defaultValues: values });
  return (
    <View style={styles.row}>
      <PeriodFields control={form.control} />
      <View style={styles.button}>
        <Button label="Show" onPress={form.handleSubmit(onApply)} />
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: 12, alignItems: 'flex-end' },
  field: { flexGrow: 1, flexBasis: 150 },
  button: { paddingBottom: 22 },
});
