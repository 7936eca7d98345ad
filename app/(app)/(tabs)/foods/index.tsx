import { Stack } from 'expo-router';
import { FoodSearchScreen } from '@/components/foods/food-search-screen';

export default function FoodsRoute() {
  return (
    <>
      <Stack.Screen options={{ title: 'Food table · Carbwright' }} />
      <FoodSearchScreen />
    </>
  );
}
