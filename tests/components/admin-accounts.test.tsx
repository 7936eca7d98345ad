import { configure, fireEvent, screen, waitFor, within } from '@testing-library/react';
import { AccountsScreen } from '@/components/admin/accounts-screen';
import type { AdminUser } from '@/shared/schemas/accounts-admin';
import { ME, expectErrorUnder, fakeApi, fieldErrors, renderSignedIn } from './render-with-api';

jest.setTimeout(60_000);
// The first render loads the router and the screen: allow for a busy machine.
configure({ asyncUtilTimeout: 10_000 });

// Invented accounts: these tests check what is sent and where messages land.
const ADMIN_ME = { ...ME, user: { ...ME.user, role: 'admin' as const } };
const account = (id: number, displayName: string, email: string, over: Partial<AdminUser> = {}): AdminUser => ({
  id, email, displayName, role: 'member', createdAt: '2026-03-01T09:00:00.000Z', disabledAt: null, disabledReason: null, ...over,
});
const ROBIN = account(1, 'Robin', 'cook@example.test', { role: 'admin' });
const ADA = account(2, 'Ada', 'ada@clinic.example');
const SAM = account(3, 'Sam', 'sam@example.test');

const sent = (api: jest.Mock, method: string, path: string) => {
  const call = api.mock.calls.find(([url, init]) => String(url).endsWith(path) && init?.method === method);
  return call ? JSON.parse(String(call[1].body)) : undefined;
};
const rowOf = async (name: string) => within(await screen.findByRole('listitem', { name }));
const type = (label: string, value: string) => fireEvent.change(screen.getByLabelText(label, { selector: 'input, textarea' }), { target: { value } });

describe('the admin desk: accounts', () => {
  it('searches by part of the address or name and lists what the server found', async () => {
    const api = fakeApi({ 'GET /me': [200, ADMIN_ME], 'GET /admin/users': [200, { users: [ROBIN, ADA, SAM] }], 'GET /admin/users?q=clinic': [200, { users: [ADA] }] });
    renderSignedIn(AccountsScreen);

    const list = await screen.findByRole('list', { name: 'Accounts' });
    expect(within(list).getAllByRole('listitem')).toHaveLength(3);
    type('Search by e-mail address or name', 'clinic');

    await waitFor(() => expect(within(screen.getByRole('list', { name: 'Accounts' })).getAllByRole('listitem')).toHaveLength(1));
    expect(screen.getByText(/ada@clinic\.example/)).toBeInTheDocument();
    expect(api.mock.calls.some(([url]) => String(url).endsWith('/admin/users?q=clinic'))).toBe(true);
    // Your own account has no buttons: another admin changes it.
    expect(screen.queryByRole('button', { name: 'Change role of Robin' })).toBeNull();
  });

  it('changes a role only with a reason, sends the role and the reason, and says what changed', async () => {
    const api = fakeApi({
      'GET /me': [200, ADMIN_ME],
      'GET /admin/users': [200, { users: [ROBIN, ADA] }],
      'PUT /admin/users/2/role': (body) => [200, { ...ADA, role: (body as { role: string }).role }],
    });
    renderSignedIn(AccountsScreen);

    fireEvent.click((await rowOf('Ada')).getByRole('button', { name: 'Change role of Ada' }));
    fireEvent.click(screen.getByRole('radio', { name: /^Clinician/ }));
    fireEvent.click(screen.getByRole('button', { name: 'Change the role of Ada' }));
    await expectErrorUnder('Reason for the change', 'Say why, in a few words.');
    expect(sent(api, 'PUT', '/admin/users/2/role')).toBeUndefined();

    type('Reason for the change', 'Diabetes nurse at the clinic');
    fireEvent.click(screen.getByRole('button', { name: 'Change the role of Ada' }));

    expect(await screen.findByText('Ada is now a clinician.')).toBeInTheDocument();
    expect(sent(api, 'PUT', '/admin/users/2/role')).toEqual({ role: 'clinician', reason: 'Diabetes nurse at the clinic' });
  });

  it('disables after a warning and a reason; a server field error lands under the reason, a conflict above the buttons', async () => {
    let answer = fieldErrors({ reason: ['Use at most 500 characters.'] });
    const api = fakeApi({
      'GET /me': [200, ADMIN_ME],
      'GET /admin/users': [200, { users: [ROBIN, SAM] }],
      'POST /admin/users/3/disable': () => answer,
    });
    renderSignedIn(AccountsScreen);

    fireEvent.click((await rowOf('Sam')).getByRole('button', { name: 'Disable Sam' }));
    expect(screen.getByText(/signed out everywhere/)).toBeInTheDocument();
    type('Reason for disabling', 'Asked to close the account');
    fireEvent.click(screen.getByRole('button', { name: 'Yes, disable Sam' }));
    await expectErrorUnder('Reason for disabling', 'Use at most 500 characters.');

    answer = [409, { error: { code: 'conflict', message: 'You cannot change your own account here; ask another admin.' } }];
    fireEvent.click(screen.getByRole('button', { name: 'Yes, disable Sam' }));
    expect(await screen.findByText('You cannot change your own account here; ask another admin.')).toBeInTheDocument();

    answer = [200, { ...SAM, disabledAt: '2026-03-02T10:00:00.000Z', disabledReason: 'Asked to close the account' }];
    fireEvent.click(screen.getByRole('button', { name: 'Yes, disable Sam' }));
    expect(await screen.findByText("Sam's account is disabled.")).toBeInTheDocument();
    expect(sent(api, 'POST', '/admin/users/3/disable')).toEqual({ reason: 'Asked to close the account' });
  });

  it('enables a disabled account with a reason', async () => {
    const api = fakeApi({
      'GET /me': [200, ADMIN_ME],
      'GET /admin/users': [200, { users: [account(3, 'Sam', 'sam@example.test', { disabledAt: '2026-03-02T10:00:00.000Z', disabledReason: 'Lost phone' })] }],
      'POST /admin/users/3/enable': [200, SAM],
    });
    renderSignedIn(AccountsScreen);

    expect(await screen.findByText(/Lost phone/)).toBeInTheDocument();
    fireEvent.click(screen.getByRole('button', { name: 'Enable Sam' }));
    type('Reason for enabling', 'Found the phone');
    fireEvent.click(screen.getByRole('button', { name: 'Yes, enable Sam' }));

    expect(await screen.findByText("Sam's account is enabled again.")).toBeInTheDocument();
    expect(sent(api, 'POST', '/admin/users/3/enable')).toEqual({ reason: 'Found the phone' });
  });

  it('tells someone who is not an admin that the desk is for admins, and asks for no accounts', async () => {
    const api = fakeApi({});
    renderSignedIn(AccountsScreen);

    expect(await screen.findByText(/Only an administrator/)).toBeInTheDocument();
    expect(api.mock.calls.some(([url]) => String(url).includes('/admin/'))).toBe(false);
  });
});
