import { Stack } from 'expo-router';
import { OutboxScreen } from '@/components/admin/outbox-screen';

export default function OutboxRoute() {
  return (
    <>
      <Stack.Screen options={{ title: 'Outbox · Carbwright' }} />
      <OutboxScreen />
    </>
  );
}
