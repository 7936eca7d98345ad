import { Stack } from 'expo-router';
import { SettingsHomeScreen } from '@/components/settings/settings-home-screen';

export default function SettingsRoute() {
  return (
    <>
      <Stack.Screen options={{ title: 'Settings · Carbwright' }} />
      <SettingsHomeScreen />
    </>
  );
}
