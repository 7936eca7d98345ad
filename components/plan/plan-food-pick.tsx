import { useState } from 'react';
import { useController, type Control } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';
import { carbInBasis } from '../../shared/compute/nutrients';
import { formatCarb } from '../../shared/compute/units';
import type { PlanMealFormValues } from '../../shared/schemas/plan';
import type { CarbBasis, CarbUnit } from '../../shared/schemas/units';
import { FoodSearchField, type PickedFood } from '../foods/food-search-field';
import { Button } from '../ui/button';
import { FieldMessage } from '../ui/field-message';
import { FormTextField } from '../ui/form-text-field';
import { Text } from '../ui/text';

/** A food by grams in a planned meal: found with the one food search (a pack food can be added there), then its grams. */
export function PlanFoodPick({ control, basis, unit }: { control: Control<PlanMealFormValues>; basis: CarbBasis; unit: CarbUnit }) {
  const food = useController({ control, name: 'foodId' });
  const [picked, setPicked] = useState<PickedFood | null>(null);
  const pick = (f: PickedFood) => {
    setPicked(f);
    food.field.onChange(f.id);
  };
  return (
    <View style={styles.stack}>
      {picked && food.field.value != null ? (
        <View style={styles.stack}>
          <Text weight="bold">{picked.name}</Text>
          <Text color="textMuted">{formatCarb(carbInBasis(picked.per100g, basis), unit)} carbohydrate per 100 g</Text>
          <View style={styles.start}>
            <Button variant="quiet" label="Pick another food" onPress={() => food.field.onChange(null)} />
          </View>
        </View>
      ) : (
        <FoodSearchField label="Food" verb="Plan" onPick={pick} placeholder="Search foods and pack foods" />
      )}
      <FieldMessage error={food.fieldState.error?.message} />
      <FormTextField control={control} name="grams" label="Grams" unit="g" keyboardType="decimal-pad" />
    </View>
  );
}

const styles = StyleSheet.create({ stack: { gap: 8 }, start: { alignItems: 'flex-start' } });
