import { Stack } from 'expo-router';
import { PlanSettingsScreen } from '@/components/plan/plan-settings-screen';

export default function PlanSettingsRoute() {
  return (
    <>
      <Stack.Screen options={{ title: 'Weekly pattern and meals · Carbwright' }} />
      <PlanSettingsScreen />
    </>
  );
}
