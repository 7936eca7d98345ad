import { Stack } from 'expo-router';
import { SignUpScreen } from '@/components/auth/sign-up-screen';

export default function SignUpRoute() {
  return (
    <>
      <Stack.Screen options={{ title: 'Create an account · Carbwright' }} />
      <SignUpScreen />
    </>
  );
}
