import { profileActionAllowed, type ProfileAction } from '../../shared/schemas/profile-actions';

// The roles per action follow the README's "Who may do what" table (owner and carer write the logbook and the plan;
// a clinician reads; only the owner manages access); the extra permissions are the care-team issue's.
describe('profileActionAllowed', () => {
  const cases: { name: string; grant: Parameters<typeof profileActionAllowed>[0]; action: ProfileAction; allowed: boolean }[] = [
    { name: 'an owner manages access', grant: { role: 'owner' }, action: 'access.manage', allowed: true },
    { name: 'a carer does not manage access', grant: { role: 'carer' }, action: 'access.manage', allowed: false },
    { name: 'a carer writes the logbook', grant: { role: 'carer' }, action: 'log.write', allowed: true },
    { name: 'a clinician reads the logbook', grant: { role: 'clinician' }, action: 'log.read', allowed: true },
    { name: 'a clinician never writes the logbook', grant: { role: 'clinician' }, action: 'log.write', allowed: false },
    { name: 'a clinician never writes it, whatever the permissions', grant: { role: 'clinician', permissions: ['settings', 'ratios'] }, action: 'log.write', allowed: false },
    { name: 'a clinician does not cook', grant: { role: 'clinician' }, action: 'kitchen.write', allowed: false },
    { name: 'a clinician writes the plan: no', grant: { role: 'clinician' }, action: 'plan.write', allowed: false },
    { name: 'no permissions: null is the same as none', grant: { role: 'carer', permissions: null }, action: 'access.manage', allowed: false },
  ];
  it.each(cases)('$name', ({ grant, action, allowed }) => {
    expect(profileActionAllowed(grant, action)).toBe(allowed);
  });
});
