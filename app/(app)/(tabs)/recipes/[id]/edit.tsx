import { Stack, useLocalSearchParams } from 'expo-router';
import { RecipeEditorScreen } from '@/components/recipes/recipe-editor-screen';

export default function EditRecipeRoute() {
  const { id } = useLocalSearchParams<{ id: string }>();
  return (
    <>
      <Stack.Screen options={{ title: 'Edit recipe · Carbwright' }} />
      <RecipeEditorScreen id={Number(id)} />
    </>
  );
}
