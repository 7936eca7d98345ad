import { QueryClient } from '@tanstack/react-query';
import { ApiError } from './client';

/**
 * One QueryClient for the app: no retries on 4xx, short stale time. Queries pause while offline (the offline copy
 * shows meanwhile); a mutation always runs, so offline it fails at once with "Not saved" instead of waiting to be sent.
 */
export function createQueryClient() {
  return new QueryClient({
    defaultOptions: {
      queries: {
        staleTime: 30_000,
        retry: (count, error) => !(error instanceof ApiError && error.status >= 400 && error.status < 500) && count < 2,
        refetchOnWindowFocus: false,
      },
      mutations: { retry: false, networkMode: 'always' },
    },
  });
}
