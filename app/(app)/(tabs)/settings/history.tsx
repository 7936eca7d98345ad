import { Stack } from 'expo-router';
import { HistoryScreen } from '@/components/settings/history-screen';

export default function SettingsHistoryRoute() {
  return (
    <>
      <Stack.Screen options={{ title: 'Change history · Carbwright' }} />
      <HistoryScreen />
    </>
  );
}
