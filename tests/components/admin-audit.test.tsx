import { configure, fireEvent, screen, within } from '@testing-library/react';
import { AuditScreen } from '@/components/admin/audit-screen';
import type { AdminAuditEntry } from '@/shared/schemas/accounts-admin';
import { ME, fakeApi, renderSignedIn } from './render-with-api';

jest.setTimeout(60_000);
// The first render loads the router and the screen: allow for a busy machine.
configure({ asyncUtilTimeout: 10_000 });

// Invented entries, newest first as the server sends them.
const ADMIN_ME = { ...ME, user: { ...ME.user, role: 'admin' as const } };
const boss = { id: 1, email: 'cook@example.test' };
const owner = { id: 4, email: 'owner@example.test' };
const nurse = { id: 2, email: 'ada@clinic.example' };
const profile = { id: 9, displayName: 'Sam' };
const ENTRIES: AdminAuditEntry[] = [
  { source: 'account', id: 3, action: 'role_changed', user: nurse, actor: boss, oldValue: 'member', newValue: 'clinician', reason: 'Diabetes nurse at the clinic', createdAt: '2026-03-02T10:00:00.000Z' },
  { source: 'access', id: 12, action: 'revoked', profile, user: nurse, email: nurse.email, actor: owner, role: 'carer', permissions: ['settings'], createdAt: '2026-03-02T09:30:00.000Z' },
  { source: 'access', id: 11, action: 'granted', profile, user: nurse, email: nurse.email, actor: nurse, role: 'carer', permissions: [], createdAt: '2026-03-02T09:10:00.000Z' },
  { source: 'access', id: 10, action: 'invited', profile, user: null, email: nurse.email, actor: owner, role: 'carer', permissions: [], createdAt: '2026-03-02T09:00:00.000Z' },
  { source: 'account', id: 2, action: 'disabled', user: nurse, actor: null, oldValue: null, newValue: null, reason: 'Lost phone', createdAt: '2026-03-01T09:00:00.000Z' },
];

describe('the admin desk: audit', () => {
  it('lists role changes with their reason and access to profiles in words, newest first, and filters by kind', async () => {
    fakeApi({ 'GET /me': [200, ADMIN_ME], 'GET /admin/audit': [200, { entries: ENTRIES }] });
    renderSignedIn(AuditScreen);

    const lines = () => within(screen.getByRole('list', { name: 'Audit' })).getAllByRole('listitem').map((li) => li.textContent ?? '');
    await screen.findByRole('list', { name: 'Audit' });
    const expected = [
      'cook@example.test changed the role of ada@clinic.example from member to clinician',
      'owner@example.test revoked the access of ada@clinic.example to profile “Sam” (was as carer, may change settings)',
      'ada@clinic.example was given access to profile “Sam” as carer',
      'owner@example.test invited ada@clinic.example to profile “Sam” as carer',
      'Someone (account since removed) disabled the account of ada@clinic.example',
    ];
    // Each line starts with the sentence; the reason and the time follow it.
    expect(lines().map((l, i) => l.slice(0, expected[i]?.length))).toEqual(expected);
    expect(screen.getByText('Reason: Diabetes nurse at the clinic')).toBeInTheDocument();

    fireEvent.click(screen.getByRole('radio', { name: 'Access to profiles' }));
    expect(lines()).toHaveLength(3);
  });
});
