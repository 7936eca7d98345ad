import { Stack, useLocalSearchParams } from 'expo-router';
import { FoodDetailScreen } from '@/components/foods/food-detail-screen';

export default function FoodRoute() {
  const { id } = useLocalSearchParams<{ id: string }>();
  return (
    <>
      <Stack.Screen options={{ title: 'Food · Carbwright' }} />
      <FoodDetailScreen id={Number(id)} />
    </>
  );
}
