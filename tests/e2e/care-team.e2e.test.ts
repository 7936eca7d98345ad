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
  await page.getByRole('button', { name: new RegExp(`Showing ${profile.displayName}'s data`) }).waitFor();
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
  await page.getByRole('button', { name: /switch profile$/ }).click();
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

describe('care team in the browser: invite, accept, revoke', () => {
  // One story in three steps (each within the test time limit); later steps use the pages of the earlier ones.
  let owner: Session;
  let ownerPage: Page;
  let carer: Page;
  const carerEmail = 'jo-carer@example.test';

  it('the owner invites a carer on the People screen and the fake SMTP server captures the mail', async () => {
    owner = await signUp('Alex', 'alex-owner@example.test');
    await logMeal(owner.token, owner.me.profiles[0].id, "Alex's porridge", 42);
    ownerPage = await rig.newPage(WIDE);
    await rig.signIn(ownerPage, owner.token);
    await ownerPage.goto(`${rig.baseUrl}/more/people`);
    await ownerPage.getByRole('list', { name: 'People with access' }).getByText('Alex', { exact: true }).waitFor();
    const after = await lastCapturedId(rig.sequelize);
    await ownerPage.getByLabel('Their email address').fill(carerEmail);
    await ownerPage.getByRole('button', { name: 'Send invitation' }).click();
    await ownerPage.getByText('Invitation sent.').waitFor();
    await ownerPage.getByText(carerEmail, { exact: true }).waitFor();
    await shotBoth(ownerPage, 'owner-invited');

    const mail = await waitForMail(rig.sequelize, carerEmail, { after });
    expect(mail.subject).toBe("Alex invites you to Alex's kitchen on Carbwright");

    // A fresh browser context (own cookies and storage): signed out, the link goes to sign-in and comes back after.
    carer = await rig.newPage(PHONE);
    await carer.goto(onRig(linkIn(mail, '/invitation')));
    await carer.waitForURL(/\/sign-in\?next=/);
  });

  it('the carer signs up with the invited address from the link, accepts, switches profiles and reads the owner\'s logbook', async () => {
    const ownerProfile = owner.me.profiles[0];
    await carer.getByText('Create an account').click();
    await carer.waitForURL(/\/sign-up\?next=/);
    await carer.getByLabel('Your name').fill('Jo');
    await carer.getByLabel('Email').fill(carerEmail);
    await carer.getByLabel('Password').fill(PASSWORD);
    await carer.getByRole('button', { name: 'Create account' }).click();
    await carer.waitForURL(/\/invitation\?token=/);
    await carer.getByText(/Alex invites you to Alex's profile as a carer/).waitFor();
    await rig.shot(carer, 'carer-invitation-phone');
    await carer.getByRole('button', { name: 'Accept invitation' }).click();
    await carer.waitForURL(`${rig.baseUrl}/`);
    await expectShowing(carer, ownerProfile);

    // Switch to their own profile and back from the header; the owner's logbook is what the carer then reads.
    const own = (await meOf(carer)).profiles.find((p) => p.access === 'owner')!;
    await switchTo(carer, 'Jo');
    await expectShowing(carer, own);
    await switchTo(carer, 'Alex');
    await expectShowing(carer, ownerProfile);
    await carer.goto(`${rig.baseUrl}/logbook`);
    await carer.getByText("Alex's porridge · 42 g").first().waitFor();
    await expectShowing(carer, ownerProfile);
    await shotBoth(carer, 'carer-reads-owner-logbook');
  });

  it('the owner revokes: the carer\'s session holds but the profile answers 404, and the header drops it and says so', async () => {
    const ownerProfile = owner.me.profiles[0];
    await ownerPage.reload();
    const people = ownerPage.getByRole('list', { name: 'People with access' });
    await people.getByText('Jo', { exact: true }).waitFor();
    await ownerPage.getByRole('button', { name: 'Revoke Jo' }).click();
    await people.getByText('Jo', { exact: true }).waitFor({ state: 'detached' });
    await shotBoth(ownerPage, 'owner-revoked');

    const status = await carer.evaluate(async (id) => (await fetch(`/api/profiles/${id}/log-entries/recent`, { credentials: 'same-origin' })).status, ownerProfile.id);
    expect(status).toBe(404);
    expect(await carer.evaluate(async () => (await fetch('/api/me', { credentials: 'same-origin' })).status)).toBe(200);

    // The next screen asks for that profile: the answer drops it, and the header says so and shows the carer's own.
    await carer.getByRole('tab', { name: 'Plan' }).click();
    await carer.getByRole('status').getByText("Alex's profile is no longer shared with you. Showing Jo's data.").waitFor();
    const me = await meOf(carer);
    expect(me.profiles.map((p) => p.displayName)).toEqual(['Jo']);
    await expectShowing(carer, me.profiles[0]);
    await shotBoth(carer, 'carer-after-revoke');
    await carer.reload();
    await carer.getByRole('button', { name: /Showing Jo's data/ }).waitFor();
    expect(await carer.getByText('Alex', { exact: true }).count()).toBe(0);
    await Promise.all([carer.context().close(), ownerPage.context().close()]);
  });
});

describe('care team in the browser: a carer with two profiles', () => {
  let session: Session;
  let jo: ProfileSummary;
  let sam: ProfileSummary;
  beforeAll(async () => {
    session = await signUp('Jo', 'jo-two-profiles@example.test');
    jo = session.me.profiles[0];
    const created = await request(rig.baseUrl).post('/api/profiles').set(auth(session.token)).send({ displayName: 'Sam' }).expect(201);
    sam = (created.body.me as Session['me']).profiles.find((p) => p.id === created.body.id)!;
    await request(rig.baseUrl).put(`/api/profiles/${sam.id}/settings`).set(auth(session.token)).send(TEST_DOSE_SETTINGS).expect(200);
    await addDayKind(session.token, jo.id, 'Rest day');
    await addDayKind(session.token, sam.id, 'School day');
    await logMeal(session.token, jo.id, 'Pasta bake', 62);
    await logMeal(session.token, sam.id, 'Fish fingers and peas', 24);
  });

  // What each profile's own data looks like on the screens that show it: present for the active one, absent for the other.
  const OWN = { Jo: ['Pasta bake · 62 g', 'Rest day'], Sam: ['Fish fingers and peas · 24 g', 'School day'] } as const;
  const SCREENS = [
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

  const [first, second] = [SCREENS.slice(0, 5), SCREENS.slice(5)];
  const withData = SCREENS.filter((x) => x.shows !== undefined);
  // Each viewport: one profile on every screen (in two steps, to stay within the test time limit), the other on the
  // screens that list its own entries and day kinds, so the data is seen to follow the switch.
  it.each([
    { size: 'phone', viewport: PHONE, to: 'Sam', from: 'Jo', screens: first },
    { size: 'phone', viewport: PHONE, to: 'Sam', from: 'Jo', screens: second },
    { size: 'phone', viewport: PHONE, to: 'Jo', from: 'Sam', screens: withData },
    { size: 'wide', viewport: WIDE, to: 'Jo', from: 'Sam', screens: first },
    { size: 'wide', viewport: WIDE, to: 'Jo', from: 'Sam', screens: second },
    { size: 'wide', viewport: WIDE, to: 'Sam', from: 'Jo', screens: withData },
  ] as const)('$size: switched from the header to $to (from $from), each screen names that profile, also after a reload', async ({ size, viewport, to, from, screens }) => {
    expect(sam.colour).not.toBe(jo.colour);
    const [profile, other] = to === 'Jo' ? [jo, sam] : [sam, jo];
    const page = await rig.newPage(viewport);
    await rig.signIn(page, session.token);
    await page.goto(`${rig.baseUrl}/`);
    await switchTo(page, from);
    await expectShowing(page, other);
    await switchTo(page, to);
    await expectShowing(page, profile);
    await rig.shot(page, `${size}-switched-to-${to}`);
    for (const screen of screens) {
      // Each page is opened by address: a full load, so the choice has to survive it.
      await page.goto(`${rig.baseUrl}${screen.path}`);
      await page.getByRole('heading', { level: 1 }).first().waitFor();
      await expectShowing(page, profile);
      if (screen.shows !== undefined) {
        await page.getByText(OWN[to][screen.shows]).first().waitFor();
        expect(await page.getByText(OWN[from][screen.shows]).count()).toBe(0);
      }
      await rig.shot(page, `${size}-${to}-${screen.name}`);
    }
    await page.reload();
    await expectShowing(page, profile);
    await page.context().close();
  });
});

/** The signed-in person's profiles as the page's session sees them. */
async function meOf(page: Page): Promise<Session['me']> {
  return page.evaluate(async () => (await fetch('/api/me', { credentials: 'same-origin' })).json());
}
