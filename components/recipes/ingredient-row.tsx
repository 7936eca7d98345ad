import { useState } from 'react';
import { useController, useFormState, useWatch, type Control } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';
import type { RecipeInputParsed } from '../../shared/schemas/recipe';
import { useTheme } from '../theme/use-theme';
import { Button } from '../ui/button';
import { FormGrid } from '../ui/form-grid';
import { FormTextField } from '../ui/form-text-field';
import { Text } from '../ui/text';
import { showGrams } from './recipe-format';
import type { RecipeFormValues } from './recipe-request';

type Props = {
  control: Control<RecipeFormValues, unknown, RecipeInputParsed>;
  index: number;
  count: number;
  onMove: (from: number, to: number) => void;
  onRemove: (index: number) => void;
};

/**
 * One ingredient of the editor, compact: the food, its grams and remove on one line; household measure, note,
 * measure shortcuts and order behind "Details" (opened by itself when one of those fields has an error).
 */
export function IngredientRow({ control, index, count, onMove, onRemove }: Props) {
  const t = useTheme();
  const name = useWatch({ control, name: `ingredients.${index}.foodName` });
  const measures = useWatch({ control, name: `ingredients.${index}.measures` });
  const measureText = useWatch({ control, name: `ingredients.${index}.measureLabel` });
  const noteText = useWatch({ control, name: `ingredients.${index}.note` });
  const food = useController({ control, name: `ingredients.${index}.foodId` });
  const grams = useController({ control, name: `ingredients.${index}.grams` });
  const measureLabel = useController({ control, name: `ingredients.${index}.measureLabel` });
  const { errors } = useFormState({ control, name: [`ingredients.${index}.measureLabel`, `ingredients.${index}.note`] });
  const detailError = errors.ingredients?.[index]?.measureLabel != null || errors.ingredients?.[index]?.note != null;
  const [open, setOpen] = useState(false);
  const showDetails = open || detailError;
  const summary = [measureText?.trim(), noteText?.trim()].filter(Boolean).join(' · ');
  return (
    <View style={[styles.line, { borderColor: t.colors.border }]} aria-label={`Ingredient ${index + 1}: ${name}`}>
      <View style={styles.main}>
        <View style={styles.name}>
          <Text weight="bold">
            {index + 1}. {name}
          </Text>
          {summary ? <Text color="textMuted">{summary}</Text> : null}
          {food.fieldState.error ? <Text color="danger">{food.fieldState.error.message}</Text> : null}
        </View>
        <View style={styles.grams}>
          <FormTextField control={control} name={`ingredients.${index}.grams`} label={`Grams of ${name}`} inputMode="decimal" unit="g" />
        </View>
      </View>
      <View style={styles.row}>
        <Button
          variant="quiet"
          label={showDetails ? 'Hide details' : 'Details'}
          aria-label={`${showDetails ? 'Hide details' : 'Details'} for ${name}`}
          aria-expanded={showDetails}
          onPress={() => setOpen(!showDetails)}
        />
        <Button variant="quiet" label={`Remove ${name}`} onPress={() => onRemove(index)} />
      </View>
      {showDetails ? (
        <View style={styles.details}>
          <FormGrid minCell={160}>
            <FormTextField control={control} name={`ingredients.${index}.measureLabel`} label="Household measure (optional)" placeholder="1 cup" />
            <FormTextField control={control} name={`ingredients.${index}.note`} label="Note (optional)" placeholder="grated" />
          </FormGrid>
          {measures.length ? (
            <View style={styles.row} role="group" aria-label={`Household measures for ${name}`}>
              {measures.slice(0, 4).map((m) => (
                <Button
                  key={m.label}
                  variant="secondary"
                  label={`${m.label} = ${showGrams(m.grams)}`}
                  onPress={() => {
                    grams.field.onChange(String(m.grams));
                    measureLabel.field.onChange(m.label);
                  }}
                />
              ))}
            </View>
          ) : null}
          <View style={styles.row}>
            <Button variant="quiet" label="Move up" disabled={index === 0} onPress={() => onMove(index, index - 1)} />
            <Button variant="quiet" label="Move down" disabled={index === count - 1} onPress={() => onMove(index, index + 1)} />
          </View>
        </View>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  line: { gap: 2, paddingBottom: 8, borderBottomWidth: 1 },
  main: { flexDirection: 'row', alignItems: 'flex-start', gap: 12 },
  name: { flex: 1, minWidth: 0, paddingTop: 28, gap: 2 },
  grams: { width: 132 },
  details: { gap: 8, paddingTop: 4 },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: 8 },
});
