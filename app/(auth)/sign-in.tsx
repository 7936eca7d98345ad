import { Stack } from 'expo-router';
import { SignInScreen } from '@/components/auth/sign-in-screen';

export default function SignInRoute() {
  return (
    <>
      <Stack.Screen options={{ title: 'Sign in · Carbwright' }} />
      <SignInScreen />
    </>
  );
}
