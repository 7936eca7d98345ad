import { fireEvent, render, screen, waitFor } from '@testing-library/react';
import { onlineManager, QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { ExpoRoot, Slot } from 'expo-router';
import type { ReactElement } from 'react';
import { getMockContext } from 'expo-router/build/testing-library/mock-config';
import { authKeys } from '@/components/api/auth';
import { batchKeys } from '@/components/api/batches';
import { apiFetch, ApiError } from '@/components/api/client';
import { containerKeys } from '@/components/api/containers';
import { dayKeys } from '@/components/api/days';
import { isOfflineQuery, OFFLINE_COPY_MAX_AGE_MS, restoreOfflineCopy, saveOfflineCopy, withOfflineCopy } from '@/components/api/offline-copy';
import { offlineCopyStore } from '@/components/api/offline-copy-store';
import { NOT_SAVED_OFFLINE } from '@/components/api/online';
import { planKeys } from '@/components/api/plan';
import { settingsKeys } from '@/components/api/profile-settings';
import { createQueryClient } from '@/components/api/query-client';
import { SessionProvider, useSession } from '@/components/auth/session';
import { DoseCheckScreen } from '@/components/dose/dose-check-screen';
import { KitchenScreen } from '@/components/kitchen/kitchen-screen';
import { localToday } from '@/components/kitchen/kitchen-format';
import { offlineStampText } from '@/components/offline/offline-notice';
import { TodayScreen } from '@/components/today/today-screen';
import { Button } from '@/components/ui/button';
import type { BatchSummary } from '@/shared/schemas/batch';
import type { DayKind, DayKindDay } from '@/shared/schemas/profile-settings';
import { fakeApi, ME } from './render-with-api';

// Rendering whole screens is slow on a shared machine; no timing is asserted.
jest.setTimeout(30_000);

const STORAGE_KEY = 'carbwright.offline-copy';
const signInCookie = () => (document.cookie = 'cw_csrf=test-csrf; path=/');
const signOutCookie = () => (document.cookie = 'cw_csrf=; Max-Age=0; path=/');

/** The browser says it is offline (the app reads navigator.onLine at start) and the query library knows. */
function goOffline() {
  jest.spyOn(navigator, 'onLine', 'get').mockReturnValue(false);
  onlineManager.setOnline(false);
}

beforeEach(() => {
  localStorage.clear();
  signInCookie();
});
afterEach(() => {
  jest.restoreAllMocks();
  onlineManager.setOnline(true);
});

// Invented data: these tests check what is kept and shown offline, not any arithmetic.
const today = localToday();
const KINDS: DayKind[] = [
  { id: 1, name: 'Rest', isDefault: true, longActingUnits: null, glucoseUnit: 'mmol_l', timesOfDay: [{ from: '00:00', to: '24:00', carbRatio: 12, correctionFactor: 2.5 }], updatedAt: '2026-03-01T00:00:00.000Z' },
  { id: 2, name: 'Swim day', isDefault: false, longActingUnits: null, glucoseUnit: 'mmol_l', timesOfDay: [{ from: '00:00', to: '24:00', carbRatio: 18, correctionFactor: 2.5 }], updatedAt: '2026-03-01T00:00:00.000Z' },
];
const DAYS: DayKindDay[] = [{ date: today, dayKindId: 1, dayKindName: 'Rest', isSet: false }];
const BATCH: BatchSummary = {
  id: 5, profileId: 1, recipeId: 2, recipeTitle: 'Lentil soup', cookedOn: today, storage: 'fridge', useBy: today, useBySource: 'default',
  cookedGrams: 900, basis: 'available', unit: 'g', carbPer100g: { grams: 12, inUnit: 12 }, counts: { available: 1, eaten: 0, discarded: 0 },
  portions: [{ id: 9, code: 'K7MQ4P', batchId: 5, profileId: 1, position: 1, containerName: null, grossGrams: null, tareGrams: null, netGrams: 300, carb: { grams: 36, inUnit: 36 }, status: 'available', statusChangedAt: null }],
} as BatchSummary;

/** A client holding what Today and the kitchen showed for profile 1, fetched at `at`, plus settings that are not kept. */
function clientWithTodayData(at: number) {
  const qc = new QueryClient();
  qc.setQueryData(authKeys.me(), ME, { updatedAt: at });
  qc.setQueryData(settingsKeys.dayKinds(1), KINDS, { updatedAt: at });
  qc.setQueryData(dayKeys.list(1, today, today), DAYS, { updatedAt: at });
  qc.setQueryData(planKeys.next(1), { meal: null, dayKind: null }, { updatedAt: at });
  qc.setQueryData(batchKeys.list({ profileId: 1, include: 'available' }), [BATCH], { updatedAt: at });
  qc.setQueryData(batchKeys.list({ profileId: 1, include: 'all' }), [BATCH], { updatedAt: at });
  qc.setQueryData(containerKeys.list(1), [], { updatedAt: at });
  qc.setQueryData(settingsKeys.settings(1), { secret: 'ratios' }, { updatedAt: at });
  return qc;
}

/** "HH:MM" of an instant in UTC, worked out here with Intl rather than with the app's formatter. */
const utcClock = (t: number) => new Intl.DateTimeFormat('en-GB', { timeZone: 'UTC', hour: '2-digit', minute: '2-digit', hourCycle: 'h23' }).format(t);

describe('which queries the offline copy keeps', () => {
  it.each([
    { name: 'the signed-in person', key: authKeys.me(), kept: true },
    { name: "Today's portions not eaten yet", key: batchKeys.list({ profileId: 1, include: 'available' }), kept: true },
    { name: "the kitchen's fridge and freezer list", key: batchKeys.list({ profileId: 1, include: 'all' }), kept: true },
    { name: 'the containers beside it', key: containerKeys.list(1), kept: true },
    { name: 'the day kinds', key: settingsKeys.dayKinds(1), kept: true },
    { name: "today's kind of day", key: dayKeys.list(1, '2026-12-02', '2026-12-02'), kept: true },
    { name: 'the next planned meal', key: planKeys.next(1), kept: true },
    { name: "another profile's fridge", key: batchKeys.list({ profileId: 2, include: 'available' }), kept: false },
    { name: "another profile's day kinds", key: settingsKeys.dayKinds(2), kept: false },
    { name: 'the dose settings', key: settingsKeys.settings(1), kept: false },
    { name: 'the week plan', key: planKeys.week(1, undefined), kept: false },
    { name: 'a batch page', key: batchKeys.detail(1, 5), kept: false },
  ])('$name: $kept', ({ key, kept }) => {
    expect(isOfflineQuery(key, 1)).toBe(kept);
  });
});

describe('saving and restoring the copy', () => {
  it('keeps the shown queries with their own fetch times, and nothing else', () => {
    const at = Date.now() - 3_600_000;
    saveOfflineCopy(clientWithTodayData(at));
    const restored = new QueryClient();
    restoreOfflineCopy(restored);

    expect(restored.getQueryData(batchKeys.list({ profileId: 1, include: 'available' }))).toEqual([BATCH]);
    expect(restored.getQueryState(batchKeys.list({ profileId: 1, include: 'available' }))?.dataUpdatedAt).toBe(at);
    expect(restored.getQueryData(authKeys.me())).toEqual(ME);
    expect(restored.getQueryData(settingsKeys.settings(1))).toBeUndefined();
    // Shown at once, but never taken as fresh: online, the screen fetches it again (a portion eaten since must go).
    expect(restored.getQueryState(batchKeys.list({ profileId: 1, include: 'available' }))?.isInvalidated).toBe(true);
    expect(restored.getQueryState(authKeys.me())?.isInvalidated).toBe(true);
  });

  it.each([
    { name: 'without a session cookie', signedOut: true, age: 60_000 },
    { name: 'older than the longest it may be shown', signedOut: false, age: OFFLINE_COPY_MAX_AGE_MS + 60_000 },
  ])('drops a copy $name instead of showing it', ({ signedOut, age }) => {
    const now = Date.now();
    saveOfflineCopy(clientWithTodayData(now - age), now - age);
    if (signedOut) signOutCookie();
    const restored = new QueryClient();
    restoreOfflineCopy(restored, now);

    expect(restored.getQueryData(authKeys.me())).toBeUndefined();
    expect(localStorage.getItem(STORAGE_KEY)).toBeNull();
  });

  it('writes nothing once signed out, and clearing forgets it', () => {
    saveOfflineCopy(clientWithTodayData(Date.now()));
    expect(localStorage.getItem(STORAGE_KEY)).toContain('Lentil soup');
    offlineCopyStore.clear();
    signOutCookie();
    saveOfflineCopy(clientWithTodayData(Date.now()));
    expect(localStorage.getItem(STORAGE_KEY)).toBeNull();
  });
});

describe('the "as of" stamp', () => {
  const at = Date.UTC(2026, 11, 2, 13, 5);
  it.each([
    // Clock times by hand: London is UTC+0 in December, New York UTC−5, Auckland UTC+13 (daylight saving) — from memory.
    { name: 'the same day, in London', asOf: at, now: at + 3_600_000, zone: 'Europe/London', text: 'Offline — as of 13:05' },
    { name: 'the same day, in New York', asOf: at, now: at + 3_600_000, zone: 'America/New_York', text: 'Offline — as of 08:05' },
    { name: 'a copy from the day before says its date', asOf: at, now: at + 86_400_000, zone: 'Europe/London', text: 'Offline — as of Wed 2 Dec 13:05' },
    { name: 'past midnight in Auckland it is already the 3rd', asOf: at, now: at + 60_000, zone: 'Pacific/Auckland', text: 'Offline — as of 02:05' },
    { name: 'no copy at all', asOf: null, now: at, zone: 'UTC', text: 'Offline — nothing saved on this device yet' },
  ])('$name', ({ asOf, now, zone, text }) => {
    expect(offlineStampText(asOf, now, zone)).toBe(text);
  });
});

describe('writes offline', () => {
  it('are refused without sending anything, and say they were not saved', async () => {
    const api = fakeApi({ 'POST /recipes': [201, { id: 1 }] });
    goOffline();

    const sent = apiFetch('/recipes', { method: 'POST', body: { title: 'Soup' } });

    await expect(sent).rejects.toBeInstanceOf(ApiError);
    await expect(sent).rejects.toMatchObject({ status: 0, code: 'offline', message: NOT_SAVED_OFFLINE });
    expect(api).not.toHaveBeenCalled();
  });
});

function OfflineRoot() {
  return (
    <QueryClientProvider client={withOfflineCopy(createQueryClient())}>
      <SessionProvider>
        <Slot />
      </SessionProvider>
    </QueryClientProvider>
  );
}
const renderWithCopy = (Screen: () => ReactElement) =>
  render(<ExpoRoot context={getMockContext({ _layout: OfflineRoot, index: Screen })} location="/" />);

describe('screens offline', () => {
  it('Today shows the copy read-only with its time, and a change of day kind says it was not saved', async () => {
    const at = Date.now() - 2 * 60_000;
    saveOfflineCopy(clientWithTodayData(at));
    const api = fakeApi({});
    goOffline();
    renderWithCopy(() => <TodayScreen />);

    await screen.findByText(`! Offline — as of ${utcClock(at)}`);
    expect(screen.getByText('Lentil soup')).toBeInTheDocument();
    fireEvent.click(screen.getByRole('radio', { name: 'Swim day' }));

    await screen.findByText(NOT_SAVED_OFFLINE);
    expect(screen.getByLabelText('Today’s kind of day')).toHaveTextContent('Rest');
    expect(api).not.toHaveBeenCalled();
  });

  it('the kitchen shows its fridge list from the copy with the stamp', async () => {
    const at = Date.now() - 5 * 60_000;
    saveOfflineCopy(clientWithTodayData(at));
    fakeApi({});
    goOffline();
    renderWithCopy(() => <KitchenScreen />);

    await screen.findByText(`! Offline — as of ${utcClock(at)}`);
    expect(screen.getAllByText('Lentil soup').length).toBeGreaterThan(0);
  });

  it('the dose check refuses offline and shows no form', async () => {
    saveOfflineCopy(clientWithTodayData(Date.now()));
    fakeApi({});
    goOffline();
    renderWithCopy(() => <DoseCheckScreen />);

    await screen.findByText('!! Offline: no dose is worked out');
    expect(screen.queryByRole('button', { name: 'Check a dose' })).toBeNull();
    expect(screen.queryByLabelText('Glucose now')).toBeNull();
  });

  it('signing out forgets the copy', async () => {
    saveOfflineCopy(clientWithTodayData(Date.now()));
    fakeApi({});
    function SignOut() {
      const { signOut } = useSession();
      return <Button label="Sign out" onPress={signOut} />;
    }
    renderWithCopy(SignOut);
    fireEvent.click(await screen.findByRole('button', { name: 'Sign out' }));

    await waitFor(() => expect(localStorage.getItem(STORAGE_KEY)).toBeNull());
  });
});
