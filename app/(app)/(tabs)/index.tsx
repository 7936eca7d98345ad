import { Stack } from 'expo-router';
import { TodayScreen } from '@/components/today/today-screen';

export default function TodayRoute() {
  return (
    <>
      <Stack.Screen options={{ title: 'Today · Carbwright' }} />
      <TodayScreen />
    </>
  );
}
