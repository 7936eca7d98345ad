import { Stack } from 'expo-router';
import { ImportsScreen } from '@/components/admin/imports-screen';

export default function ImportsRoute() {
  return (
    <>
      <Stack.Screen options={{ title: 'Dataset imports · Carbwright' }} />
      <ImportsScreen />
    </>
  );
}
