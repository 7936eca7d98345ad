import { fireEvent, screen, waitFor } from '@testing-library/react';
import { ChangeEmailScreen } from '@/components/more/change-email-screen';
import { expectErrorUnder, fakeApi, fieldErrors, renderSignedIn } from './render-with-api';

// Rendering whole screens is slow on a shared machine; no timing is asserted.
jest.setTimeout(30_000);

const type = (label: string, value: string) => fireEvent.change(screen.getByLabelText(label, { selector: 'input, textarea' }), { target: { value } });
const press = (name: string) => fireEvent.click(screen.getByRole('button', { name }));
const posts = (api: jest.Mock) => api.mock.calls.filter(([, init]) => init?.method === 'POST');

describe('ChangeEmailScreen', () => {
  it('checks both fields with the shared schema before sending anything', async () => {
    const api = fakeApi({});
    renderSignedIn(ChangeEmailScreen);

    type('New e-mail address', 'not an address');
    press('Send the confirmation link');

    await expectErrorUnder('New e-mail address', 'Enter a valid email address.');
    await expectErrorUnder('Current password', 'Enter your current password.');
    expect(posts(api)).toHaveLength(0);
  });

  it('puts the server\'s answer about the password under that field', async () => {
    fakeApi({ 'POST /auth/email': fieldErrors({ currentPassword: ['That is not your current password.'] }) });
    renderSignedIn(ChangeEmailScreen);

    type('New e-mail address', 'new@example.test');
    type('Current password', 'a wrong guess');
    press('Send the confirmation link');

    await expectErrorUnder('Current password', 'That is not your current password.');
  });

  it('sends the address as the shared schema reads it and shows where the link went', async () => {
    const message = 'We have sent a link to robin.new@example.test. Your address stays cook@example.test until you open that link and confirm; it works for one hour.';
    const api = fakeApi({ 'POST /auth/email': [202, { message }] });
    renderSignedIn(ChangeEmailScreen);

    type('New e-mail address', '  Robin.New@Example.test ');
    type('Current password', 'correct horse battery');
    press('Send the confirmation link');

    expect(await screen.findByText(message)).toBeInTheDocument();
    const [, init] = posts(api)[0];
    expect(JSON.parse(String(init.body))).toEqual({ newEmail: 'robin.new@example.test', currentPassword: 'correct horse battery' });
    await waitFor(() => expect(screen.getByLabelText('Current password', { selector: 'input' })).toHaveValue(''));
  });
});
