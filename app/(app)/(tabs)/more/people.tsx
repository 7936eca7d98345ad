import { Stack } from 'expo-router';
import { PeopleScreen } from '@/components/access/people-screen';

export default function PeopleRoute() {
  return (
    <>
      <Stack.Screen options={{ title: 'People with access · Carbwright' }} />
      <PeopleScreen />
    </>
  );
}
