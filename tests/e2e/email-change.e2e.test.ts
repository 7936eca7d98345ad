import request from 'supertest';
import { PHONE, startBrowserRig, type BrowserRig } from '../helpers/browser';
import { lastCapturedId, linkIn, waitForMail } from '../helpers/mail';

let rig: BrowserRig;
beforeAll(async () => {
  rig = await startBrowserRig('email-change');
});
afterAll(async () => {
  await rig?.close();
});

const OLD_EMAIL = 'moving@example.test';
const NEW_EMAIL = 'moved@example.test';
const PASSWORD = 'a long kitchen passphrase';

/** The path and query of a mailed link, opened on this test's server (mail links use PUBLIC_URL). */
const onRig = (link: URL) => `${rig.baseUrl}${link.pathname}${link.search}`;

describe('email change in the browser, through the captured mail', () => {
  it('email change: asks on its page, confirms from the link while signed in, the old address is told and the link then fails', async () => {
    const signUp = await request(rig.baseUrl).post('/api/auth/sign-up').send({ email: OLD_EMAIL, displayName: 'Robin', password: PASSWORD }).expect(201);
    const page = await rig.newPage(PHONE);
    await rig.signIn(page, signUp.body.token);
    await page.goto(`${rig.baseUrl}/more/email`);
    const after = await lastCapturedId(rig.sequelize);
    await page.getByLabel('New e-mail address').fill(NEW_EMAIL);
    await page.getByLabel('Current password').fill(PASSWORD);
    await page.getByRole('button', { name: 'Send the confirmation link' }).click();
    await page.getByText('Check the new inbox').waitFor();
    await rig.shot(page, 'link-sent');

    const link = linkIn(await waitForMail(rig.sequelize, NEW_EMAIL, { after, subject: 'Confirm your new' }), '/confirm-email');
    await page.goto(onRig(link));
    await page.getByRole('button', { name: 'Confirm the new address' }).click();
    await page.getByText(`From now on, sign in with ${NEW_EMAIL}.`, { exact: false }).waitFor();
    await rig.shot(page, 'confirmed');

    const told = await waitForMail(rig.sequelize, OLD_EMAIL, { after, subject: 'has changed' });
    expect(told.text).toContain(NEW_EMAIL);
    expect((await request(rig.baseUrl).post('/api/auth/sign-in').send({ email: NEW_EMAIL, password: PASSWORD })).status).toBe(200);
    expect((await request(rig.baseUrl).post('/api/auth/sign-in').send({ email: OLD_EMAIL, password: PASSWORD })).status).toBe(401);

    await page.goto(onRig(link));
    await page.getByRole('button', { name: 'Confirm the new address' }).click();
    await page.getByText('This link has expired or has already been used. Ask for a new one.').waitFor();
    await rig.shot(page, 'used-link');
  });
});
