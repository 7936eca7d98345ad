/**
 * The offline copy: what Today and the kitchen's fridge list last showed for the active profile, kept on this device
 * (the one device storage) with the time each part was fetched, so both open read-only without a connection. Nothing
 * else is kept: not the dose settings. The day kinds (with their ratios) and the next planned meal (with its planned
 * dose) are in it for Today's cards, but no dose is worked out or shown from them offline. Cleared on sign-out and
 * whenever no session cookie is present.
 */
import { dehydrate, hydrate, partialMatchKey, useQueryClient, type DehydratedState, type QueryClient, type QueryKey } from '@tanstack/react-query';
import { useSyncExternalStore } from 'react';
import type { Me } from '../../shared/schemas/auth';
import { activeProfileStore } from '../auth/active-profile-store';
import { sessionCookie } from '../auth/session-cookie';
import { authKeys } from './auth';
import { batchKeys } from './batches';
import { ApiError } from './client';
import { containerKeys } from './containers';
import { offlineCopyStore } from './offline-copy-store';
import { dayKeys } from './days';
import { startOnlineWatch, useIsOnline } from './online';
import { planKeys } from './plan';
import { settingsKeys } from './profile-settings';

const VERSION = 1;
/** A copy older than this is dropped rather than shown. */
export const OFFLINE_COPY_MAX_AGE_MS = 7 * 24 * 3_600_000;
const SAVE_DELAY_MS = 300;

type StoredCopy = { version: number; savedAt: number; state: DehydratedState };

/** The profile whose copy is kept: the active one, picked as useActiveProfile picks it. */
function keptProfileId(me: Me | undefined): number | undefined {
  const chosen = activeProfileStore.get();
  return me?.profiles.find((p) => p.id === chosen)?.id ?? me?.profiles[0]?.id;
}

/** True for a query Today or the fridge list shows for this profile: the only queries kept offline. */
export function isOfflineQuery(key: QueryKey, profileId: number): boolean {
  const kept: QueryKey[] = [
    authKeys.me(),
    [...batchKeys.lists(), { profileId }],
    containerKeys.list(profileId),
    settingsKeys.dayKinds(profileId),
    dayKeys.lists(profileId),
    planKeys.next(profileId),
  ];
  return kept.some((prefix) => partialMatchKey(key, prefix));
}

let saveTimer: ReturnType<typeof setTimeout> | undefined;

/** Writes the kept queries of the signed-in person's active profile, with their fetch times; nothing once signed out. */
export function saveOfflineCopy(qc: QueryClient, now = Date.now()) {
  if (!sessionCookie.csrf()) return offlineCopyStore.clear();
  const me = qc.getQueryData<Me>(authKeys.me());
  const profileId = keptProfileId(me);
  if (!me || profileId == null) return;
  const state = dehydrate(qc, {
    shouldDehydrateQuery: (q) => q.state.status === 'success' && isOfflineQuery(q.queryKey, profileId),
    shouldDehydrateMutation: () => false,
  });
  const copy: StoredCopy = { version: VERSION, savedAt: now, state };
  // Storage full or refused: keep no copy rather than an older one.
  if (!offlineCopyStore.write(JSON.stringify(copy))) offlineCopyStore.clear();
}

/** Puts the kept copy back into the query cache (each query with its own fetch time); drops one too old or unsigned. */
export function restoreOfflineCopy(qc: QueryClient, now = Date.now()) {
  const raw = offlineCopyStore.read();
  if (!raw) return;
  let copy: StoredCopy | undefined;
  try {
    copy = JSON.parse(raw) as StoredCopy;
  } catch {
    copy = undefined;
  }
  if (!copy || copy.version !== VERSION || !sessionCookie.csrf() || now - copy.savedAt > OFFLINE_COPY_MAX_AGE_MS) return offlineCopyStore.clear();
  const queries = copy.state.queries.filter((q) => now - q.state.dataUpdatedAt <= OFFLINE_COPY_MAX_AGE_MS);
  hydrate(qc, { ...copy.state, queries });
  // The copy is for when the server cannot be reached: online, every restored query is fetched again when a screen
  // shows it (within the stale time it would otherwise pass as fresh, e.g. a portion eaten since would still show).
  for (const q of queries) void qc.invalidateQueries({ queryKey: q.queryKey, exact: true, refetchType: 'none' });
}

/**
 * The app's query client with its offline copy: restored at start, written again shortly after any kept query
 * succeeds. Kept queries are held in memory as long as the copy may be shown, so none drops out of it unseen.
 */
export function withOfflineCopy(qc: QueryClient): QueryClient {
  for (const family of [authKeys.me(), batchKeys.lists(), containerKeys.lists(), settingsKeys.all, planKeys.all]) {
    qc.setQueryDefaults(family, { gcTime: OFFLINE_COPY_MAX_AGE_MS });
  }
  startOnlineWatch();
  restoreOfflineCopy(qc);
  qc.getQueryCache().subscribe((event) => {
    if (event.type !== 'updated' || event.action.type !== 'success') return;
    const profileId = keptProfileId(qc.getQueryData<Me>(authKeys.me()));
    if (profileId == null || !isOfflineQuery(event.query.queryKey, profileId)) return;
    clearTimeout(saveTimer);
    saveTimer = setTimeout(() => saveOfflineCopy(qc), SAVE_DELAY_MS);
  });
  return qc;
}

const unreachable = (error: unknown) => error instanceof ApiError && error.status === 0;

/**
 * Whether a screen shows its offline copy (the device is offline, or one of its queries could not reach the server)
 * and as of when: the oldest fetch time of the screen's queries, so the stamp never claims fresher than the oldest part.
 */
export function useOfflineCopy(keys: readonly QueryKey[]): { offline: boolean; asOf: number | null } {
  const online = useIsOnline();
  const qc = useQueryClient();
  const cache = qc.getQueryCache();
  const failed = useSyncExternalStore(
    cache.subscribe,
    () => keys.some((k) => unreachable(qc.getQueryState(k)?.error)),
    () => false,
  );
  if (online && !failed) return { offline: false, asOf: null };
  const times = keys.map((k) => qc.getQueryState(k)?.dataUpdatedAt ?? 0).filter((t) => t > 0);
  return { offline: true, asOf: times.length ? Math.min(...times) : null };
}
