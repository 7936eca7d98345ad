import { Stack } from 'expo-router';
import { PackFoodScreen } from '@/components/foods/pack-food-screen';

export default function NewPackFoodRoute() {
  return (
    <>
      <Stack.Screen options={{ title: 'Add a pack food · Carbwright' }} />
      <PackFoodScreen />
    </>
  );
}
