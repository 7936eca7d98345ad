import { Stack } from 'expo-router';
import { AddEntryScreen } from '@/components/logbook/add-entry-screen';

export default function AddLogEntryRoute() {
  return (
    <>
      <Stack.Screen options={{ title: 'Add an entry · Carbwright' }} />
      <AddEntryScreen />
    </>
  );
}
