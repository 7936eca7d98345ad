import { Stack } from 'expo-router';
import { MoreScreen } from '@/components/more/more-screen';

export default function MoreRoute() {
  return (
    <>
      <Stack.Screen options={{ title: 'You · Carbwright' }} />
      <MoreScreen />
    </>
  );
}
