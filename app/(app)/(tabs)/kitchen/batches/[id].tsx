import { Stack, useLocalSearchParams } from 'expo-router';
import { BatchDetailScreen } from '@/components/kitchen/batch-detail-screen';

export default function BatchRoute() {
  const { id } = useLocalSearchParams<{ id: string }>();
  return (
    <>
      <Stack.Screen options={{ title: 'Batch · Carbwright' }} />
      <BatchDetailScreen id={Number(id)} />
    </>
  );
}
