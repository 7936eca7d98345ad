import { Stack, useLocalSearchParams } from 'expo-router';
import { localToday } from '@/components/kitchen/kitchen-format';
import { PlanMealScreen } from '@/components/plan/plan-meal-screen';

export default function PlanMealRoute() {
  const { date } = useLocalSearchParams<{ date?: string }>();
  return (
    <>
      <Stack.Screen options={{ title: 'Plan a meal · Carbwright' }} />
      <PlanMealScreen date={date || localToday()} />
    </>
  );
}
