import { Stack } from 'expo-router';
import { UnitsSafetyScreen } from '@/components/settings/units-safety-screen';

export default function UnitsSafetyRoute() {
  return (
    <>
      <Stack.Screen options={{ title: 'Units and safety limits · Carbwright' }} />
      <UnitsSafetyScreen />
    </>
  );
}
