import { Stack } from 'expo-router';
import { RecipesScreen } from '@/components/recipes/recipes-screen';

export default function RecipesRoute() {
  return (
    <>
      <Stack.Screen options={{ title: 'Recipes · Carbwright' }} />
      <RecipesScreen />
    </>
  );
}
