import { Stack } from 'expo-router';
import { DayKindsScreen } from '@/components/settings/day-kinds-screen';

export default function DayKindsRoute() {
  return (
    <>
      <Stack.Screen options={{ title: 'Day kinds and ratios · Carbwright' }} />
      <DayKindsScreen />
    </>
  );
}
