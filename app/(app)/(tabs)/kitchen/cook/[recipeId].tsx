import { Stack, useLocalSearchParams } from 'expo-router';
import { CookBatchScreen } from '@/components/kitchen/cook-batch-screen';

export default function CookRoute() {
  const { recipeId } = useLocalSearchParams<{ recipeId: string }>();
  return (
    <>
      <Stack.Screen options={{ title: 'Cooking · Carbwright' }} />
      <CookBatchScreen recipeId={Number(recipeId)} />
    </>
  );
}
