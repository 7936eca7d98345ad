import { configure, fireEvent, screen, within } from '@testing-library/react';
import { OutboxScreen } from '@/components/admin/outbox-screen';
import type { OutboxMail } from '@/shared/schemas/mail';
import { ME, fakeApi, renderSignedIn } from './render-with-api';

jest.setTimeout(60_000);
// The first render loads the router and the screen: allow for a busy machine.
configure({ asyncUtilTimeout: 10_000 });

// Invented outbox rows: the tests check what is shown and what is sent.
const ADMIN_ME = { ...ME, user: { ...ME.user, role: 'admin' as const } };
const mail = (id: number, over: Partial<OutboxMail>): OutboxMail => ({
  id, kind: 'invitation', to: 'nurse@clinic.example', subject: 'Robin invites you to Sam’s profile', status: 'pending', attempts: 0, lastError: null,
  nextAttemptAt: null, sentAt: null, createdAt: '2026-03-02T09:00:00.000Z', canResend: false, ...over,
});
const FAILED = mail(7, { status: 'failed', attempts: 8, lastError: 'connect ECONNREFUSED 127.0.0.1:2525', canResend: true });
const WAITING = mail(8, { to: 'dad@example.test', subject: 'Reset your password', kind: 'password_reset', attempts: 2, lastError: 'greeting never received', nextAttemptAt: '2026-03-02T09:05:00.000Z' });

describe('the admin desk: outbox', () => {
  it('shows the waiting and failed mails with attempts and the last error, and resends a failed one', async () => {
    let resent = false;
    const api = fakeApi({
      'GET /me': [200, ADMIN_ME],
      'GET /admin/mail?status=unsent': () => [200, { mails: resent ? [WAITING, { ...FAILED, status: 'pending', attempts: 0, canResend: false }] : [WAITING, FAILED] }],
      'POST /admin/mail/7/resend': () => {
        resent = true;
        return [200, { ...FAILED, status: 'pending', attempts: 0, canResend: false }];
      },
    });
    renderSignedIn(OutboxScreen);

    const failed = within(await screen.findByRole('listitem', { name: 'Robin invites you to Sam’s profile to nurse@clinic.example' }));
    expect(failed.getByText('Failed: given up after 8 attempts')).toBeInTheDocument();
    expect(failed.getByText('Last error: connect ECONNREFUSED 127.0.0.1:2525')).toBeInTheDocument();
    const waiting = within(screen.getByRole('listitem', { name: 'Reset your password to dad@example.test' }));
    expect(waiting.getByText(/^Waiting: 2 attempts so far · next try/)).toBeInTheDocument();
    expect(waiting.queryByRole('button')).toBeNull();

    fireEvent.click(failed.getByRole('button', { name: 'Resend to nurse@clinic.example' }));

    expect(await screen.findByText('The mail to nurse@clinic.example goes out with the next round of sending.')).toBeInTheDocument();
    expect(api.mock.calls.filter(([url, init]) => String(url).endsWith('/admin/mail/7/resend') && init?.method === 'POST')).toHaveLength(1);
    expect(await screen.findByText('Waiting: 0 attempts so far')).toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Resend to nurse@clinic.example' })).toBeNull();
  });

  it('asks the server for one status when chosen, and says when nothing is stuck', async () => {
    fakeApi({ 'GET /me': [200, ADMIN_ME], 'GET /admin/mail?status=unsent': [200, { mails: [] }], 'GET /admin/mail?status=sent': [200, { mails: [mail(9, { status: 'sent', attempts: 1, sentAt: '2026-03-02T09:01:00.000Z' })] }] });
    renderSignedIn(OutboxScreen);

    expect(await screen.findByText('Every mail has gone out.')).toBeInTheDocument();
    fireEvent.click(screen.getByRole('radio', { name: 'Sent' }));

    expect(await screen.findByText(/^Sent .* after 1 attempt$/)).toBeInTheDocument();
  });
});
