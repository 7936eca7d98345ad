import { Redirect, Slot, useLocalSearchParams } from 'expo-router';
import { safeNext, useSession } from '@/components/auth/session';

export default function AuthLayout() {
  const { status } = useSession();
  const { next } = useLocalSearchParams<{ next?: string }>();
  if (status === 'loading') return null;
  if (status === 'signed-in') return <Redirect href={safeNext(next)} />;
  return <Slot />;
}
