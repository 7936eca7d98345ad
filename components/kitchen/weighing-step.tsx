import { useState } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';
import { weighingDifference } from '../../shared/compute/batch';
import { useTheme } from '../theme/use-theme';
import { Button } from '../ui/button';
import { Callout } from '../ui/callout';
import { Card } from '../ui/card';
import { Text } from '../ui/text';
import { useFormState, useWatch } from 'react-hook-form';
import { FormTextField } from '../ui/form-text-field';
import type { CookForm } from './cook-batch-screen';
import { num } from './cook-state';
import { gramsText } from './kitchen-format';
import { FoodSearchField } from '../foods/food-search-field';

type Props = {
  form: CookForm;
  index: number;
  onIndex: (i: number) => void;
  onDone: () => void;
};

/** The weighing checklist: one ingredient at a time, planned grams, the scale reading, the difference. */
export function WeighingStep({ form, index, onIndex, onDone }: Props) {
  const t = useTheme();
  const [swapping, setSwapping] = useState(false);
  const lines = useWatch({ control: form.control, name: 'lines' });
  const line = lines[index];
  const { errors } = useFormState({ control: form.control, name: 'lines' });
  const linesError = errors.lines?.message ?? errors.lines?.root?.message;
  const reading = num(line.reading);
  const diff = reading == null ? null : weighingDifference(line.plannedGrams, reading);
  const last = index === lines.length - 1;
  const ready = line.omitted || (reading != null && reading > 0);

  return (
    <View style={styles.stack}>
      <Card aria-label="Weighing checklist">
        <Text variant="label" color="textMuted">
          Ingredient {index + 1} of {lines.length}
        </Text>
        <Text variant="title">{line.foodName}</Text>
        {line.swappedFrom ? <Text color="textMuted">In place of {line.swappedFrom.foodName}</Text> : null}
        <View style={styles.numbers}>
          <View>
            <Text variant="label" color="textMuted">
              Planned
            </Text>
            <Text variant="number">{gramsText(line.plannedGrams)}</Text>
          </View>
          {diff != null && !line.omitted ? (
            <View>
              <Text variant="label" color="textMuted">
                Difference
              </Text>
              <Text variant="number" color={Math.abs(diff) > Math.max(5, line.plannedGrams * 0.1) ? 'caution' : 'text'}>
                {diff > 0 ? '+' : diff < 0 ? '−' : '±'}
                {gramsText(Math.abs(diff))}
              </Text>
            </View>
          ) : null}
        </View>
        {linesError ? <Callout tone="danger">{linesError}</Callout> : null}
        {line.omitted ? (
          <Callout tone="info" title="Left out">
            This ingredient counts for nothing in the batch.
          </Callout>
        ) : (
          <FormTextField
            key={index}
            control={form.control}
            name={`lines.${index}.reading`}
            label="Scale reading"
            unit="g"
            keyboardType="decimal-pad"
            hint="Tare note: put the bowl on the scale and press tare first, so the scale shows only this ingredient."
            style={styles.big}
            autoFocus
          />
        )}
        <View style={styles.row}>
          <Button
            variant="secondary"
            label={line.omitted ? 'Put it back in' : 'Leave it out'}
            onPress={() => form.setValue(`lines.${index}.omitted`, !line.omitted, { shouldDirty: true })}
          />
          <Button variant="secondary" label={swapping ? 'Cancel swap' : 'Swap for another food'} onPress={() => setSwapping(!swapping)} />
        </View>
        {swapping ? (
          <FoodSearchField
            label="Search foods"
            verb="Use"
            placeholder="Type at least 2 letters"
            onPick={(food) => {
              form.setValue(`lines.${index}`, {
                ...line,
                foodId: food.id,
                foodName: food.name,
                per100g: food.per100g,
                swappedFrom: line.swappedFrom ?? { foodId: line.foodId, foodName: line.foodName },
              });
              setSwapping(false);
            }}
          />
        ) : null}
        <View style={styles.row}>
          {index > 0 ? <Button variant="quiet" label="‹ Previous" onPress={() => onIndex(index - 1)} /> : null}
          <Button
            size="lg"
            label={last ? 'All weighed: weigh the pot' : 'Next ingredient'}
            disabled={!ready}
            onPress={() => (last ? onDone() : onIndex(index + 1))}
          />
        </View>
      </Card>
      <View role="list" aria-label="Ingredients" style={styles.list}>
        {lines.map((l, i) => {
          const r = num(l.reading);
          return (
            <Pressable key={i} role="listitem" onPress={() => onIndex(i)} style={[styles.item, { borderColor: i === index ? t.colors.primary : t.colors.border }]}>
              <Text weight={i === index ? 'bold' : 'regular'} style={styles.grow}>
                {l.omitted ? '— ' : r != null && r > 0 ? '✓ ' : '○ '}
                {l.foodName}
              </Text>
              <Text color="textMuted">{l.omitted ? 'left out' : r != null && r > 0 ? `${gramsText(r)} of ${gramsText(l.plannedGrams)}` : gramsText(l.plannedGrams)}</Text>
            </Pressable>
          );
        })}
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  stack: { gap: 12 },
  numbers: { flexDirection: 'row', gap: 32, flexWrap: 'wrap' },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: 8, alignItems: 'center' },
  big: { fontSize: 28, minWidth: 0, width: '100%' },
  list: { gap: 6 },
  item: { flexDirection: 'row', borderWidth: 1, borderRadius: 10, padding: 10, gap: 8 },
  grow: { flex: 1 },
});
