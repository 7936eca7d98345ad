import { Stack } from 'expo-router';
import { ImportScreen } from '@/components/logbook/import-screen';

export default function ReadingsImportRoute() {
  return (
    <>
      <Stack.Screen options={{ title: 'Import readings · Carbwright' }} />
      <ImportScreen />
    </>
  );
}
