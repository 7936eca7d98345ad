import { Stack } from 'expo-router';
import { HistoryScreen } from '@/components/logbook/history-screen';

export default function LogbookRoute() {
  return (
    <>
      <Stack.Screen options={{ title: 'Logbook · Carbwright' }} />
      <HistoryScreen />
    </>
  );
}
