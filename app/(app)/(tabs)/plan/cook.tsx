import { Stack, useLocalSearchParams } from 'expo-router';
import { localToday } from '@/components/kitchen/kitchen-format';
import { PlannedCookScreen } from '@/components/plan/planned-cook-screen';

export default function PlannedCookRoute() {
  const { date } = useLocalSearchParams<{ date?: string }>();
  return (
    <>
      <Stack.Screen options={{ title: 'Plan a cook · Carbwright' }} />
      <PlannedCookScreen date={date || localToday()} />
    </>
  );
}
