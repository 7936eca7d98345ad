import { Stack } from 'expo-router';
import { LabelFoodScreen } from '@/components/foods/label-food-screen';

export default function NewLabelFoodRoute() {
  return (
    <>
      <Stack.Screen options={{ title: 'Add a label food · Carbwright' }} />
      <LabelFoodScreen />
    </>
  );
}
