import { Stack } from 'expo-router';
import { PlanScreen } from '@/components/plan/plan-screen';

export default function PlanRoute() {
  return (
    <>
      <Stack.Screen options={{ title: 'Plan · Carbwright' }} />
      <PlanScreen />
    </>
  );
}
