import { Redirect, Stack, useGlobalSearchParams, usePathname } from 'expo-router';
import { useRef } from 'react';
import { useSession } from '@/components/auth/session';
import { LoadingState } from '@/components/ui/states';

function toQuery(params: Record<string, string | string[] | undefined>) {
  return new URLSearchParams(
    Object.entries(params).flatMap(([k, v]) => (Array.isArray(v) ? v.map((x) => [k, x]) : v == null ? [] : [[k, v]])),
  ).toString();
}

/** Everything in (app) needs a session; signed-out visitors go to sign-in and come back after. */
export default function AppLayout() {
  const { status } = useSession();
  const pathname = usePathname();
  const params = useGlobalSearchParams();
  // The address asked for, as first seen: once the redirect starts the router reports '/'.
  const requested = useRef<string | null>(null);
  if (requested.current === null) {
    const query = toQuery(params);
    requested.current = query ? `${pathname}?${query}` : pathname;
  }
  if (status === 'loading') return <LoadingState />;
  if (status === 'signed-out') {
    const next = requested.current;
    return <Redirect href={(next === '/' ? '/sign-in' : `/sign-in?next=${encodeURIComponent(next)}`)} />;
  }
  requested.current = pathname;
  return <Stack screenOptions={{ headerShown: false }} />;
}
