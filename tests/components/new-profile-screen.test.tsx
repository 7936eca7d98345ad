import { fireEvent, render, screen } from '@testing-library/react';
import { ExpoRoot } from 'expo-router';
import { getMockContext } from 'expo-router/build/testing-library/mock-config';
import { Text } from 'react-native';
import { NewProfileScreen } from '@/components/access/new-profile-screen';
import { ProfileSwitcher } from '@/components/nav/profile-switcher';
import type { Me } from '@/shared/schemas/auth';
import { AppRoot, expectErrorUnder, fakeApi, fieldErrors, ME } from './render-with-api';

// Rendering whole screens is slow on a shared machine; no timing is asserted.
jest.setTimeout(30_000);

const type = (label: string, value: string) => fireEvent.change(screen.getByLabelText(label, { selector: 'input, textarea' }), { target: { value } });
const press = (name: string) => fireEvent.click(screen.getByRole('button', { name }));

const MIA = { ...ME.profiles[0], id: 2, displayName: 'Mia', colour: 'plum' as const, managed: true, timeZone: 'Europe/Dublin' };
const WITH_MIA: Me = { ...ME, profiles: [ME.profiles[0], MIA] };

/** The new-profile page and the people page, each under the header line that names the active profile. */
function renderWithSwitcher() {
  document.cookie = 'cw_csrf=test-csrf; path=/';
  const context = getMockContext({
    _layout: AppRoot,
    index: () => (
      <>
        <ProfileSwitcher />
        <NewProfileScreen />
      </>
    ),
    'more/people': () => (
      <>
        <ProfileSwitcher />
        <Text>People page</Text>
      </>
    ),
  });
  return render(<ExpoRoot context={context} location="/" />);
}

describe('NewProfileScreen', () => {
  it('creates the profile, makes it the active one in the header, and opens the people page to invite or hand over', async () => {
    const api = fakeApi({ 'POST /profiles': [201, { id: 2, me: WITH_MIA }] });
    renderWithSwitcher();
    expect(await screen.findByRole('button', { name: /Showing Robin's data/ }, { timeout: 10_000 })).toBeInTheDocument();

    type('Their name', 'Mia');
    fireEvent.click(screen.getByRole('radio', { name: 'Plum' }));
    type('Time zone', 'Europe/Dublin');
    press('Add the profile');

    expect(await screen.findByText('People page')).toBeInTheDocument();
    expect(screen.getByRole('button', { name: /Showing Mia's data; switch profile$/ })).toBeInTheDocument();
    const [, init] = api.mock.calls.find(([, i]) => i?.method === 'POST')!;
    expect(JSON.parse(String(init?.body))).toEqual({ displayName: 'Mia', colour: 'plum', timeZone: 'Europe/Dublin' });
  });

  it('asks for a name and a real time zone before sending, and shows a server error under its field', async () => {
    const api = fakeApi({ 'POST /profiles': fieldErrors({ displayName: ['Use at most 80 characters.'] }) });
    renderWithSwitcher();
    await screen.findByRole('button', { name: /Showing Robin's data/ }, { timeout: 10_000 });

    type('Time zone', 'Mars/Olympus');
    press('Add the profile');

    await expectErrorUnder('Their name', 'Give the profile a name.');
    await expectErrorUnder('Time zone', 'Use a time zone name such as Europe/London or America/New_York.');
    expect(api.mock.calls.filter(([, i]) => i?.method === 'POST')).toHaveLength(0);

    type('Their name', 'Mia');
    type('Time zone', 'UTC');
    press('Add the profile');

    await expectErrorUnder('Their name', 'Use at most 80 characters.');
  });
});
