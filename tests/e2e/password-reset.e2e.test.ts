import request from 'supertest';
import { AccountTokenModel } from '../../server/models';
import { hashToken } from '../../server/services/account-tokens.service';
import { PHONE, startBrowserRig, type BrowserRig } from '../helpers/browser';
import { lastCapturedId, linkIn, waitForMail } from '../helpers/mail';

let rig: BrowserRig;
beforeAll(async () => {
  rig = await startBrowserRig('password-reset');
});
afterAll(async () => {
  await rig?.close();
});

const EMAIL = 'forgetful@example.test';
const OLD = 'a long kitchen passphrase';
const NEW = 'orchard lantern tangerine';

/** The path and query of a mailed link, opened on this test's server (mail links use PUBLIC_URL). */
const onRig = (link: URL) => `${rig.baseUrl}${link.pathname}${link.search}`;

describe('password reset in the browser, through the captured mail', () => {
  it('asks for a link, refuses a weak password under the field, sets a strong one, and the link then fails', async () => {
    await request(rig.baseUrl).post('/api/auth/sign-up').send({ email: EMAIL, displayName: 'Robin', password: OLD }).expect(201);
    const page = await rig.newPage(PHONE);
    await page.goto(`${rig.baseUrl}/sign-in`);
    await page.getByText('Forgotten your password?').click();
    await page.waitForURL(/\/forgot-password/);
    const after = await lastCapturedId(rig.sequelize);
    await page.getByLabel('Email').fill(EMAIL);
    await page.getByRole('button', { name: 'Send the link' }).click();
    await page.getByText('Check your e-mail').waitFor();
    await rig.shot(page, 'link-sent');

    const mail = await waitForMail(rig.sequelize, EMAIL, { after });
    expect(mail.subject).toBe('Choose a new Carbwright password');
    const link = linkIn(mail, '/reset-password');
    await page.goto(onRig(link));
    await page.getByLabel('New password').fill('password123');
    await page.getByRole('button', { name: 'Save the new password' }).click();
    await page.getByText(/commonly used password/).waitFor();
    await rig.shot(page, 'weak-password');
    await page.getByLabel('New password').fill(NEW);
    await page.getByRole('button', { name: 'Save the new password' }).click();
    await page.waitForURL(`${rig.baseUrl}/`);
    await page.getByText('Good to see you, Robin').waitFor();

    const fresh = await rig.newPage(PHONE);
    await fresh.goto(onRig(link));
    await fresh.getByLabel('New password').fill('another orchard lantern');
    await fresh.getByRole('button', { name: 'Save the new password' }).click();
    await fresh.getByText('This link has expired or has already been used. Ask for a new one.').waitFor();
    await rig.shot(fresh, 'used-link');
    const signIn = await request(rig.baseUrl).post('/api/auth/sign-in').send({ email: EMAIL, password: NEW });
    expect(signIn.status).toBe(200);
  });

  it('refuses an expired link', async () => {
    const after = await lastCapturedId(rig.sequelize);
    await request(rig.baseUrl).post('/api/auth/password-reset').send({ email: EMAIL }).expect(202);
    const link = linkIn(await waitForMail(rig.sequelize, EMAIL, { after }), '/reset-password');
    await AccountTokenModel.update({ expiresAt: new Date(Date.now() - 1000) }, { where: { tokenHash: hashToken(link.searchParams.get('token')!) } });

    const page = await rig.newPage(PHONE);
    await page.goto(onRig(link));
    await page.getByLabel('New password').fill('yet another orchard lantern');
    await page.getByRole('button', { name: 'Save the new password' }).click();

    await page.getByText('This link has expired or has already been used. Ask for a new one.').waitFor();
  });
});
