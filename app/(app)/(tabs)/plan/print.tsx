import { Stack, useLocalSearchParams } from 'expo-router';
import { localToday } from '@/components/kitchen/kitchen-format';
import { PlanPrintScreen } from '@/components/plan/plan-print-screen';

export default function PlanPrintRoute() {
  const { date } = useLocalSearchParams<{ date?: string }>();
  return (
    <>
      <Stack.Screen options={{ title: 'The week to print · Carbwright' }} />
      <PlanPrintScreen date={date || localToday()} />
    </>
  );
}
