import { Stack } from 'expo-router';

export default function AreaLayout() {
  return <Stack screenOptions={{ headerShown: false }} />;
}
