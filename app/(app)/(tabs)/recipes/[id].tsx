import { Stack, useLocalSearchParams } from 'expo-router';
import { RecipeDetailScreen } from '@/components/recipes/recipe-detail-screen';

export default function RecipeRoute() {
  const { id } = useLocalSearchParams<{ id: string }>();
  return (
    <>
      <Stack.Screen options={{ title: 'Recipe · Carbwright' }} />
      <RecipeDetailScreen id={Number(id)} />
    </>
  );
}
