import { Stack } from 'expo-router';
import { RecipeEditorScreen } from '@/components/recipes/recipe-editor-screen';

export default function NewRecipeRoute() {
  return (
    <>
      <Stack.Screen options={{ title: 'New recipe · Carbwright' }} />
      <RecipeEditorScreen />
    </>
  );
}
