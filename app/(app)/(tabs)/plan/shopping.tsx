import { Stack, useLocalSearchParams } from 'expo-router';
import { localToday } from '@/components/kitchen/kitchen-format';
import { ShoppingListScreen } from '@/components/plan/shopping-list-screen';

export default function ShoppingListRoute() {
  const { date } = useLocalSearchParams<{ date?: string }>();
  return (
    <>
      <Stack.Screen options={{ title: 'Shopping list · Carbwright' }} />
      <ShoppingListScreen date={date || localToday()} />
    </>
  );
}
