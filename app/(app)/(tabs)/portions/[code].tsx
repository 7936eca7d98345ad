import { Stack, useLocalSearchParams } from 'expo-router';
import { PortionScreen } from '@/components/kitchen/portion-screen';

export default function PortionRoute() {
  const { code } = useLocalSearchParams<{ code: string }>();
  return (
    <>
      <Stack.Screen options={{ title: 'Portion · Carbwright' }} />
      <PortionScreen code={String(code)} />
    </>
  );
}
