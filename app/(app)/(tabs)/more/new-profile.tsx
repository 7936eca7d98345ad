import { Stack } from 'expo-router';
import { NewProfileScreen } from '@/components/access/new-profile-screen';

export default function NewProfileRoute() {
  return (
    <>
      <Stack.Screen options={{ title: 'Add a profile · Carbwright' }} />
      <NewProfileScreen />
    </>
  );
}
