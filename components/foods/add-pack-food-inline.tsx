import { StyleSheet, View } from 'react-native';
import type { Food } from '../../shared/schemas/food';
import { useCreatePackFood } from '../api/foods';
import { Button } from '../ui/button';
import { Card } from '../ui/card';
import { Text } from '../ui/text';
import { emptyPackFood } from './pack-food-form-values';
import { PackFoodForm } from './pack-food-form';
import { usePackFoodShareOptions } from './pack-food-share';

type Props = { name: string; onAdded: (food: Food) => void; onCancel: () => void };

/** Adds a pack food from its label without leaving the recipe or the cook; the saved food is handed back as if picked. */
export function AddPackFoodInline({ name, onAdded, onCancel }: Props) {
  const { shareOptions } = usePackFoodShareOptions();
  const create = useCreatePackFood();
  return (
    <View style={styles.wrap} role="region" aria-label="Add a pack food">
      <Card>
        <Text variant="heading">Add a pack food</Text>
        <Text color="textMuted">Type the nutrition panel from the package. When you save, it is used here straight away.</Text>
      </Card>
      <PackFoodForm
        defaultValues={{ ...emptyPackFood, name }}
        shareOptions={shareOptions}
        submitLabel="Save pack food and use it"
        submitting={create.isPending}
        submitError={create.error}
        onSubmit={(values, photo) => create.mutate({ values, photo }, { onSuccess: ({ food }) => onAdded(food) })}
      />
      <Button variant="secondary" label="Back to the search" onPress={onCancel} />
    </View>
  );
}

const styles = StyleSheet.create({ wrap: { gap: 16 } });
