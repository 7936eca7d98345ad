import { fireEvent, screen, waitFor } from '@testing-library/react';
import { switchProfile } from '@/components/api/auth';
import { apiFetch } from '@/components/api/client';
import { ProfileSwitcher } from '@/components/nav/profile-switcher';
import { Button } from '@/components/ui/button';
import type { Me } from '@/shared/schemas/auth';
import { fakeApi, ME, renderSignedIn } from './render-with-api';

// Rendering with the router is slow on a shared machine; no timing is asserted.
jest.setTimeout(30_000);

const ALEX = { ...ME.profiles[0], id: 2, displayName: 'Alex', access: 'carer', colour: 'plum', managed: false } as const;
const WITH_ALEX: Me = { ...ME, profiles: [...ME.profiles, ALEX] };
const NOT_FOUND = [404, { error: { code: 'not_found', message: 'That profile was not found.' } }] as const;

/** The header, and a button that makes one call about profile 2 (as any screen would), ignoring its error. */
function Page() {
  return (
    <>
      <ProfileSwitcher />
      <Button label="Load Alex's logbook" onPress={() => void apiFetch('/profiles/2/log-entries/recent').catch(() => undefined)} />
    </>
  );
}

describe('profile switcher', () => {
  it('when the open profile answers 404 (access revoked), fetches the profiles again, drops it and says so by name until OK', async () => {
    let revoked = false;
    const api = fakeApi({ 'GET /me': () => [200, revoked ? ME : WITH_ALEX], 'GET /profiles/2/log-entries/recent': () => (revoked ? [...NOT_FOUND] : [200, []]) });
    switchProfile(2);
    renderSignedIn(Page);
    await screen.findByRole('button', { name: /Showing Alex's data; switch profile$/ });

    revoked = true;
    fireEvent.click(screen.getByRole('button', { name: "Load Alex's logbook" }));

    await screen.findByText("Alex's profile is no longer shared with you. Showing Robin's data.");
    expect(screen.getByRole('button', { name: /Showing Robin's data/ })).toBeTruthy();
    expect(api.mock.calls.filter(([url]) => String(url).endsWith('/api/me'))).toHaveLength(2);
    fireEvent.click(screen.getByRole('button', { name: 'OK' }));
    await waitFor(() => expect(screen.queryByText(/no longer shared with you/)).toBeNull());
  });

  it('says nothing for a profile id kept on this device that this account never had (another account used it)', async () => {
    const api = fakeApi({ 'GET /profiles/2/log-entries/recent': [...NOT_FOUND] });
    switchProfile(2);
    renderSignedIn(Page);
    await screen.findByRole('button', { name: /Showing Robin's data/ });

    fireEvent.click(screen.getByRole('button', { name: "Load Alex's logbook" }));

    await waitFor(() => expect(api.mock.calls.some(([url]) => String(url).includes('/profiles/2/'))).toBe(true));
    expect(screen.queryByText(/no longer shared with you/)).toBeNull();
    expect(api.mock.calls.filter(([url]) => String(url).endsWith('/api/me'))).toHaveLength(1);
  });
});
