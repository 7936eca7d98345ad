import { Stack } from 'expo-router';
import { PickRecipeScreen } from '@/components/kitchen/pick-recipe-screen';

export default function NewBatchRoute() {
  return (
    <>
      <Stack.Screen options={{ title: 'Cook a batch · Carbwright' }} />
      <PickRecipeScreen />
    </>
  );
}
