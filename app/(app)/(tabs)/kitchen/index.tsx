import { Stack } from 'expo-router';
import { KitchenScreen } from '@/components/kitchen/kitchen-screen';

export default function KitchenRoute() {
  return (
    <>
      <Stack.Screen options={{ title: 'Kitchen · Carbwright' }} />
      <KitchenScreen />
    </>
  );
}
