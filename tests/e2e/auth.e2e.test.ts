import { PHONE, WIDE, startBrowserRig, type BrowserRig } from '../helpers/browser';

let rig: BrowserRig;
beforeAll(async () => {
  rig = await startBrowserRig('auth');
});
afterAll(async () => {
  await rig?.close();
});

describe.each([
  ['phone', PHONE],
  ['wide', WIDE],
])('accounts in the browser (%s)', (label, viewport) => {
  it('signs up, lands on Today, survives a reload, signs out and signs back in', async () => {
    const page = await rig.newPage(viewport);
    const email = `cook-${label}@example.test`;

    await page.goto(`${rig.baseUrl}/`);
    await page.waitForURL(/\/sign-in/);
    await rig.shot(page, `${label}-sign-in`);
    await page.getByText('Create an account').click();
    await page.waitForURL(/\/sign-up/);
    await page.getByLabel('Your name').fill('Robin');
    await page.getByLabel('Email').fill(email);
    await page.getByLabel('Password').fill('short');
    await page.getByRole('button', { name: 'Create account' }).click();
    await page.getByText('Use at least 10 characters.').waitFor();
    await rig.shot(page, `${label}-sign-up-error`);
    await page.getByLabel('Password').fill('a long kitchen passphrase');
    await page.getByRole('button', { name: 'Create account' }).click();

    await page.waitForURL(`${rig.baseUrl}/`);
    await page.getByText('Good to see you, Robin').waitFor();
    await rig.shot(page, `${label}-today`);
    await page.reload();
    await page.getByText('Good to see you, Robin').waitFor();

    for (const tab of ['Recipes', 'Kitchen', 'Plan']) {
      await page.getByRole('tab', { name: tab }).click();
      await page.getByRole('heading', { name: tab, exact: true }).waitFor();
      await rig.shot(page, `${label}-${tab.toLowerCase()}`);
    }
    await page.getByRole('tab', { name: 'You' }).click();
    await page.getByText(email).waitFor();
    await rig.shot(page, `${label}-you`);
    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.waitForURL(/\/sign-in/);

    await page.getByLabel('Email').fill(email);
    await page.getByLabel('Password').fill('wrong password here');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByText('Email or password is not right.').waitFor();
    await page.getByLabel('Password').fill('a long kitchen passphrase');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByText(email).waitFor();
  });

  it('sends a signed-out visitor of an inner page to sign-in and back there after', async () => {
    const page = await rig.newPage(viewport);
    await page.goto(`${rig.baseUrl}/plan`);

    await page.waitForURL(/\/sign-in\?next=%2Fplan/);
    await page.getByLabel('Email').fill(`cook-${label}@example.test`);
    await page.getByLabel('Password').fill('a long kitchen passphrase');
    await page.getByRole('button', { name: 'Sign in' }).click();

    await page.waitForURL(`${rig.baseUrl}/plan`);
    await page.getByRole('heading', { name: 'Plan', exact: true }).waitFor();
  });
});
