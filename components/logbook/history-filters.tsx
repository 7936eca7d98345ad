import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';
import { LOG_ENTRY_KINDS } from '../../shared/schemas/logbook';
import { LOG_KIND_WORDS, logFilterFormSchema, type LogFilterFormValues } from '../../shared/schemas/logbook-read';
import { useLayout } from '../theme/use-theme';
import { Button } from '../ui/button';
import { Card } from '../ui/card';
import { FormChoiceGroup } from '../ui/form-choice-group';
import { PeriodFields } from './period-form';

const KIND_CHOICES = [{ value: '', label: 'All' }, ...LOG_ENTRY_KINDS.map((k) => ({ value: k, label: LOG_KIND_WORDS[k] }))];

/** The history filters: a period of local dates, a day kind and an entry type; applied together. */
export function HistoryFilters({
  values,
  dayKinds,
  onApply,
}: {
  values: LogFilterFormValues;
  dayKinds: { id: number; name: string }[];
  onApply: (values: LogFilterFormValues) => void;
}) {
  const { isWide } = useLayout();
  const form = useForm<LogFilterFormValues>({ resolver: zodResolver(logFilterFormSchema), defaultValues: values });
  const dayKindChoices = [{ value: '', label: 'Every day kind' }, ...dayKinds.map((k) => ({ value: String(k.id), label: k.name }))];
  return (
    <Card>
      <View style={[styles.dates, isWide && styles.row]}>
        <PeriodFields control={form.control} />
      </View>
      {dayKinds.length > 1 ? <FormChoiceGroup control={form.control} name="dayKindId" label="Day kind" choices={dayKindChoices} /> : null}
      <FormChoiceGroup control={form.control} name="kind" label="Entry type" choices={KIND_CHOICES} />
      <View style={styles.actions}>
        <Button label="Show" onPress={form.handleSubmit(onApply)} />
      </View>
    </Card>
  );
}

const styles = StyleSheet.create({
  dates: { gap: 12 },
  row: { flexDirection: 'row' },
  actions: { flexDirection: 'row' },
});
