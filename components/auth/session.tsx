import { createContext, useCallback, useContext, useEffect, useMemo, useState, type ReactNode } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { setUnauthorizedHandler } from '../api/client';
import { offlineCopyStore } from '../api/offline-copy-store';
import { sessionCookie } from './session-cookie';

type Status = 'loading' | 'signed-in' | 'signed-out';
type SessionValue = { status: Status; signIn: () => void; signOut: () => void };

const SessionContext = createContext<SessionValue | null>(null);

/** Holds whether someone is signed in (the session itself is an HttpOnly cookie); any 401 from the API signs out. Signing out forgets the offline copy. */
export function SessionProvider({ children }: { children: ReactNode }) {
  const queryClient = useQueryClient();
  const [status, setStatus] = useState<Status>('loading');

  useEffect(() => {
    setStatus(sessionCookie.csrf() ? 'signed-in' : 'signed-out');
  }, []);

  const signIn = useCallback(() => {
    setStatus('signed-in');
  }, []);
  const signOut = useCallback(() => {
    sessionCookie.clear();
    offlineCopyStore.clear();
    setStatus('signed-out');
    queryClient.clear();
  }, [queryClient]);

  useEffect(() => {
    setUnauthorizedHandler(signOut);
    return () => setUnauthorizedHandler(undefined);
  }, [signOut]);

  const value = useMemo(() => ({ status, signIn, signOut }), [status, signIn, signOut]);
  return <SessionContext.Provider value={value}>{children}</SessionContext.Provider>;
}

export function useSession(): SessionValue {
  const value = useContext(SessionContext);
  if (!value) throw new Error('useSession must be used inside SessionProvider');
  return value;
}

export { safeNext } from './safe-next';
