import type { Page } from 'playwright-core';
import request from 'supertest';
import type { ProfileSummary, Session } from '../../shared/schemas/auth';
import { PHONE, WIDE, startBrowserRig, type BrowserRig } from '../helpers/browser';
import { TEST_DOSE_SETTINGS } from '../helpers/dose-settings';
import { lastCapturedId, linkIn, waitForMail } from '../helpers/mail';

let rig: BrowserRig;
beforeAll(async () => {
  rig = await startBrowserRig('care-team');
});
afterAll(async () => {
  await rig?.close();
});

const PASSWORD = 'a long kitchen passphrase';
const auth = (token: string) => ({ Authorization: `Bearer ${token}` });

/** The path and query of a mailed link, opened on this test's server (mail links use PUBLIC_URL). */
const onRig = (link: URL) => `${rig.baseUrl}${link.pathname}${link.search}`;

async function signUp(name: string, email: string): Promise<Session> {
  const res = await request(rig.baseUrl).post('/api/auth/sign-up').send({ email, displayName: name, password: PASSWORD }).expect(201);
  return res.body as Session;
}

/** Logs a typed meal now on the profile, with the note as its title. */
async function logMeal(token: string, profileId: number, note: string, carbsGrams: number) {
  await request(rig.baseUrl).post(`/api/profiles/${profileId}/log-entries/meals`).set(auth(token)).send({ meal: { source: 'typed', carbsGrams, note } }).expect(201);
}

async function addDayKind(token: string, profileId: number, name: string) {
  await request(rig.baseUrl)
    .post(`/api/profiles/${profileId}/day-kinds`)
    .set(auth(token))
    .send({ name, isDefault: true, longActingUnits: 12, glucoseUnit: 'mmol_l', timesOfDay: [{ from: '00:00', to: '24:00', carbRatio: 10, correctionFactor: 2 }] })
    .expect(201);
}

/** The colour each profile's name was first seen in, by its colour name: the same on every page, different per colour. */
const seenColours = new Map<string, string>();

/** The header of the page names the profile whose data it shows, in that profile's own colour. */
async function expectShowing(page: Page, profile: Pick<ProfileSummary, 'displayName' | 'colour'>) {
  await page.getByRole('button', { name: new RegExp(`^Showing ${profile.displayName}'s data`) }).waitFor();
  const name = page.getByTestId('active-profile').getByText(profile.displayName, { exact: true });
  const shown = await name.evaluate((el) => getComputedStyle(el).color);
  if (!seenColours.has(profile.colour)) {
    expect([...seenColours.values()]).not.toContain(shown);
    seenColours.set(profile.colour, shown);
  }
  expect(shown).toBe(seenColours.get(profile.colour));
}

/** Picks a profile from the header's switch. */
async function switchTo(page: Page, name: string) {
  await page.getByRole('button', { name: /Switch profile$/ }).click();
  await page.getByRole('radiogroup', { name: 'Profiles' }).getByRole('radio', { name: new RegExp(`^${name}`) }).click();
}

/** The same page at phone and at wide width, one screenshot each. */
async function shotBoth(page: Page, name: string) {
  const before = page.viewportSize()!;
  for (const [size, viewport] of [['phone', PHONE], ['wide', WIDE]] as const) {
    await page.setViewportSize(viewport);
    await rig.shot(page, `${name}-${size}`);
  }
  await page.setViewportSize(before);
}

describe('care team in the browser', () => {
  it('invite by e-mail → the link in a fresh browser → sign up and accept → the owner\'s logbook → revoked: 404 and the profile leaves the switch', async () => {
    const owner = await signUp('Alex', 'alex-owner@example.test');
    const ownerProfile = owner.me.profiles[0];
    await logMeal(owner.token, ownerProfile.id, "Alex's porridge", 42);
    const ownerPage = await rig.newPage(WIDE);
    await rig.signIn(ownerPage, owner.token);
    await ownerPage.goto(`${rig.baseUrl}/more/people`);
    await ownerPage.getByRole('list', { name: 'People with access' }).getByText('Alex', { exact: true }).waitFor();
    const after = await lastCapturedId(rig.sequelize);
    await ownerPage.getByLabel('Their email address').fill('jo-carer@example.test');
    await ownerPage.getByRole('button', { name: 'Send invitation' }).click();
    await ownerPage.getByText('Invitation sent.').waitFor();
    await ownerPage.getByText('jo-carer@example.test', { exact: true }).waitFor();
    await shotBoth(ownerPage, 'owner-invited');

    const mail = await waitForMail(rig.sequelize, 'jo-carer@example.test', { after });
    expect(mail.subject).toBe("Alex invites you to Alex's kitchen on Carbwright");
    const link = linkIn(mail, '/invitation');

    // A fresh browser context (own cookies and storage): signed out, the link goes to sign-in and comes back after.
    const carer = await rig.newPage(PHONE);
    await carer.goto(onRig(link));
    await carer.waitForURL(/\/sign-in\?next=/);
    await carer.getByText('Create an account').click();
    await carer.waitForURL(/\/sign-up\?next=/);
    await carer.getByLabel('Your name').fill('Jo');
    await carer.getByLabel('Email').fill('jo-carer@example.test');
    await carer.getByLabel('Password').fill(PASSWORD);
    await carer.getByRole('button', { name: 'Create account' }).click();
    await carer.waitForURL(/\/invitation\?token=/);
    await carer.getByText(/Alex invites you to Alex's profile as a carer/).waitFor();
    await shotBoth(carer, 'carer-invitation');
    await carer.getByRole('button', { name: 'Accept invitation' }).click();
    await carer.waitForURL(`${rig.baseUrl}/`);
    await expectShowing(carer, ownerProfile);

    // Switch to their own profile and back from the header; the owner's logbook is what the carer then reads.
    await switchTo(carer, 'Jo');
    await expectShowing(carer, { displayName: 'Jo', colour: (await meOf(carer)).profiles.find((p) => p.displayName === 'Jo')!.colour });
    await switchTo(carer, 'Alex');
    await expectShowing(carer, ownerProfile);
    await carer.goto(`${rig.baseUrl}/logbook`);
    await carer.getByText("Alex's porridge · 42 g").first().waitFor();
    await expectShowing(carer, ownerProfile);
    await shotBoth(carer, 'carer-reads-owner-logbook');

    await ownerPage.reload();
    const people = ownerPage.getByRole('list', { name: 'People with access' });
    await people.getByText('Jo', { exact: true }).waitFor();
    await ownerPage.getByRole('button', { name: 'Revoke Jo' }).click();
    await people.getByText('Jo', { exact: true }).waitFor({ state: 'detached' });
    await shotBoth(ownerPage, 'owner-revoked');

    // The carer's session still holds; the profile does not answer any more (404, as for a stranger).
    const status = await carer.evaluate(async (id) => (await fetch(`/api/profiles/${id}/log-entries/recent`, { credentials: 'same-origin' })).status, ownerProfile.id);
    expect(status).toBe(404);
    expect((await carer.evaluate(async () => (await fetch('/api/me', { credentials: 'same-origin' })).status))).toBe(200);

    // The next screen asks for that profile: the answer drops it, and the header says so and shows the carer's own.
    await carer.getByRole('tab', { name: 'Plan' }).click();
    await carer.getByRole('status').getByText("Alex's profile is no longer shared with you. Showing Jo's data.").waitFor();
    await expectShowing(carer, { displayName: 'Jo', colour: (await meOf(carer)).profiles[0].colour });
    await shotBoth(carer, 'carer-after-revoke');
    await carer.reload();
    await carer.getByRole('button', { name: "Showing Jo's data" }).waitFor();
    expect(await carer.getByText('Alex', { exact: true }).count()).toBe(0);
    expect((await meOf(carer)).profiles.map((p) => p.displayName)).toEqual(['Jo']);
  });

  it('a carer with their own profile and a child\'s switches from the header; every screen names whose data it shows, also after a reload (390 and 1440)', async () => {
    const session = await signUp('Jo', 'jo-two-profiles@example.test');
    const jo = session.me.profiles[0];
    const created = await request(rig.baseUrl).post('/api/profiles').set(auth(session.token)).send({ displayName: 'Sam' }).expect(201);
    const sam = (created.body.me as Session['me']).profiles.find((p) => p.id === created.body.id)!;
    expect(sam.colour).not.toBe(jo.colour);
    await request(rig.baseUrl).put(`/api/profiles/${sam.id}/settings`).set(auth(session.token)).send(TEST_DOSE_SETTINGS).expect(200);
    await addDayKind(session.token, jo.id, 'Rest day');
    await addDayKind(session.token, sam.id, 'School day');
    await logMeal(session.token, jo.id, 'Pasta bake', 62);
    await logMeal(session.token, sam.id, 'Fish fingers and peas', 24);
    // What each profile's own data looks like on the screens that show it: present for the active one, absent for the other.
    const own = { Jo: ['Pasta bake · 62 g', 'Rest day'], Sam: ['Fish fingers and peas · 24 g', 'School day'] };
    const screens = [
      { name: 'today', path: '/' },
      { name: 'dose-check', path: '/dose-check' },
      { name: 'logbook', path: '/logbook', shows: 0 },
      { name: 'review', path: '/logbook/review' },
      { name: 'plan', path: '/plan' },
      { name: 'kitchen', path: '/kitchen' },
      { name: 'settings', path: '/settings' },
      { name: 'day-kinds', path: '/settings/day-kinds', shows: 1 },
      { name: 'settings-history', path: '/settings/history' },
    ];

    for (const [size, viewport, first, second] of [['phone', PHONE, sam, jo], ['wide', WIDE, jo, sam]] as const) {
      const page = await rig.newPage(viewport);
      await rig.signIn(page, session.token);
      await page.goto(`${rig.baseUrl}/`);
      await page.getByRole('button', { name: /Switch profile$/ }).waitFor();
      for (const profile of [first, second]) {
        await switchTo(page, profile.displayName);
        await expectShowing(page, profile);
        await rig.shot(page, `${size}-switched-to-${profile.displayName}`);
        const other = profile === jo ? sam : jo;
        for (const screen of screens) {
          // Each page is opened by address: a full load, so the choice has to survive it.
          await page.goto(`${rig.baseUrl}${screen.path}`);
          await page.getByRole('heading', { level: 1 }).first().waitFor();
          await expectShowing(page, profile);
          if (screen.shows !== undefined) {
            await page.getByText(own[profile.displayName as 'Jo' | 'Sam'][screen.shows]).first().waitFor();
            expect(await page.getByText(own[other.displayName as 'Jo' | 'Sam'][screen.shows]).count()).toBe(0);
          }
          await rig.shot(page, `${size}-${profile.displayName}-${screen.name}`);
        }
        await page.reload();
        await expectShowing(page, profile);
      }
    }
  });
});

/** The signed-in person's profiles as the page's session sees them. */
async function meOf(page: Page): Promise<Session['me']> {
  return page.evaluate(async () => (await fetch('/api/me', { credentials: 'same-origin' })).json());
}
