import { useController, useWatch, type Control } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';
import type { RecipeInputParsed } from '../../shared/schemas/recipe';
import { Button } from '../ui/button';
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

/** One ingredient of the editor: grams, household measure and note, the food's measures as shortcuts, order and remove. */
export function IngredientRow({ control, index, count, onMove, onRemove }: Props) {
  const name = useWatch({ control, name: `ingredients.${index}.foodName` });
  const measures = useWatch({ control, name: `ingredients.${index}.measures` });
  const food = useController({ control, name: `ingredients.${index}.foodId` });
  const grams = useController({ control, name: `ingredients.${index}.grams` });
  const measureLabel = useController({ control, name: `ingredients.${index}.measureLabel` });
  return (
    <View style={styles.line} aria-label={`Ingredient ${index + 1}: ${name}`}>
      <Text weight="bold">
        {index + 1}. {name}
      </Text>
      {food.fieldState.error ? <Text color="danger">{food.fieldState.error.message}</Text> : null}
      <View style={styles.fields}>
        <View style={styles.small}>
          <FormTextField control={control} name={`ingredients.${index}.grams`} label={`Grams of ${name}`} inputMode="decimal" unit="g" />
        </View>
        <View style={styles.small}>
          <FormTextField control={control} name={`ingredients.${index}.measureLabel`} label="Household measure (optional)" placeholder="1 cup" />
        </View>
        <View style={styles.small}>
          <FormTextField control={control} name={`ingredients.${index}.note`} label="Note (optional)" placeholder="grated" />
        </View>
      </View>
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
        <Button variant="quiet" label={`Remove ${name}`} onPress={() => onRemove(index)} />
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  line: { gap: 6, paddingBottom: 12 },
  fields: { flexDirection: 'row', flexWrap: 'wrap', gap: 12 },
  small: { flexGrow: 1, flexBasis: 160 },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: 8 },
});
