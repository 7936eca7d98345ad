import type { Page } from 'playwright-core';
import request from 'supertest';
import { ProfileAccessModel, UserModel } from '../../server/models';
import { PHONE, WIDE, startBrowserRig, type BrowserRig } from '../helpers/browser';
import { TEST_DOSE_SETTINGS } from '../helpers/dose-settings';
import { addLogEntries } from '../helpers/logbook';
import { overflowingElements, seriousAxeViolations, settled, smallTapTargets } from '../helpers/page-checks';

let rig: BrowserRig;
beforeAll(async () => {
  rig = await startBrowserRig('clinician-desk');
});
afterAll(async () => {
  await rig?.close();
});

const PASSWORD = 'a long kitchen passphrase';
/** Today's UTC date minus `n` days (the profile's zone is UTC, the default). */
const daysAgo = (n: number) => new Date(Date.now() - n * 86_400_000).toISOString().slice(0, 10);

async function signUp(email: string, displayName: string) {
  const res = await request(rig.baseUrl).post('/api/auth/sign-up').send({ email, displayName, password: PASSWORD });
  if (res.status !== 201) throw new Error(`sign-up: ${JSON.stringify(res.body)}`);
  return { token: res.body.token as string, userId: res.body.me.user.id as number, profileId: res.body.me.profiles[0].id as number };
}

/** Ada with invented settings, a Rest day and five breakfasts that each rose 3 mmol/L; a nurse who supports her. */
async function deskWithAda() {
  const ada = await signUp('desk-ada@example.test', 'Ada');
  const auth = { Authorization: `Bearer ${ada.token}` };
  await request(rig.baseUrl).put(`/api/profiles/${ada.profileId}/settings`).set(auth).send(TEST_DOSE_SETTINGS).expect(200);
  const kind = await request(rig.baseUrl)
    .post(`/api/profiles/${ada.profileId}/day-kinds`)
    .set(auth)
    .send({ name: 'Rest', isDefault: true, longActingUnits: null, glucoseUnit: 'mmol_l', timesOfDay: [{ from: '00:00', to: '24:00', carbRatio: 10, correctionFactor: 2 }] })
    .expect(201);
  const dayKindId = kind.body.id as number;
  for (const n of [1, 2, 3, 4, 5]) {
    const d = daysAgo(n);
    await addLogEntries(ada.profileId, [
      { kind: 'reading', at: `${d}T07:50:00Z`, glucoseMmol: 6, readingSource: 'typed', dayKindId },
      { kind: 'meal', at: `${d}T08:00:00Z`, title: `Porridge day ${n}`, mealSource: 'typed', carbAvailableG: 40, carbTotalG: 44, dayKindId },
      { kind: 'rapid_dose', at: `${d}T08:00:00Z`, units: 4, dayKindId },
      { kind: 'reading', at: `${d}T10:30:00Z`, glucoseMmol: 9, readingSource: 'typed', dayKindId },
    ]);
  }
  const nurse = await signUp('desk-nurse@example.test', 'Sam');
  await UserModel.update({ role: 'clinician' }, { where: { id: nurse.userId } });
  await ProfileAccessModel.create({ profileId: ada.profileId, userId: nurse.userId, role: 'clinician', permissions: [], grantedByUserId: ada.userId });
  return { nurse };
}

async function phoneFindings(page: Page) {
  return [
    ...(await overflowingElements(page)).map((f) => `runs past the edge: ${f}`),
    ...(await smallTapTargets(page)).map((f) => `small target: ${f}`),
    ...(await seriousAxeViolations(page)),
  ];
}

describe("the clinician's desk in the browser", () => {
  it('lists Ada with her flag at 1440 and 390, and opens her logbook read-only as the active profile', async () => {
    const { nurse } = await deskWithAda();
    const wide = await rig.newPage(WIDE);
    const phone = await rig.newPage(PHONE);
    for (const page of [wide, phone]) {
      await page.goto(`${rig.baseUrl}/sign-in`);
      await rig.signIn(page, nurse.token);
    }

    await wide.goto(`${rig.baseUrl}/desk`);
    await settled(wide);
    await wide.getByText(/glucose rose \+3\.0 mmol\/L on\s+average after 5 meals/).waitFor();
    await rig.shot(wide, 'wide-desk');
    await expect(seriousAxeViolations(wide)).resolves.toEqual([]);
    await expect(wide.getByRole('navigation', { name: 'Main' }).getByRole('tab', { name: 'Desk' }).getAttribute('aria-selected')).resolves.toBe('true');

    await phone.goto(`${rig.baseUrl}/desk`);
    await settled(phone);
    await phone.getByLabel('Ada', { exact: true }).waitFor();
    await rig.shot(phone, 'phone-desk');
    await expect(phoneFindings(phone)).resolves.toEqual([]);

    await phone.getByRole('button', { name: "Open Ada's logbook" }).click();
    await phone.waitForURL(/\/logbook$/);
    await phone.getByText('Porridge day 1 · 40 g', { exact: true }).waitFor();
    // Not settled(): the desk stays mounted (hidden) in the tab navigator, and its heading would be found first.
    await phone.waitForLoadState('networkidle');
    await rig.shot(phone, 'phone-ada-logbook');
    await expect(phone.getByTestId('active-profile').textContent()).resolves.toContain('Ada');
    await expect(phone.getByRole('button', { name: 'Add an entry' }).count()).resolves.toBe(0);
    await expect(phone.getByRole('button', { name: /^Edit / }).count()).resolves.toBe(0);
  });
});
