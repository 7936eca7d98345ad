import path from 'node:path';
import type { Page } from 'playwright-core';
import request from 'supertest';
import { PHONE, WIDE, startBrowserRig, type BrowserRig } from '../helpers/browser';
import { TEST_DOSE_SETTINGS } from '../helpers/dose-settings';
import { signUpInBrowser } from '../helpers/kitchen-flow';
import { addLogEntries } from '../helpers/logbook';

let rig: BrowserRig;
beforeAll(async () => {
  rig = await startBrowserRig('logbook');
});
afterAll(async () => {
  await rig?.close();
});

const PASSWORD = 'a long kitchen passphrase';
const FIXTURES = path.join(__dirname, '..', 'fixtures', 'readings');

/** Today's UTC date minus `n` days (the profile's zone is UTC, the default). */
const daysAgo = (n: number) => new Date(Date.now() - n * 86_400_000).toISOString().slice(0, 10);

/** Signs up in the browser, then gives the profile invented settings, one day kind and two days of entries. */
async function personWithLog(page: Page, email: string) {
  await signUpInBrowser(page, rig.baseUrl, { name: 'Lena', email });
  const session = await request(rig.baseUrl).post('/api/auth/sign-in').send({ email, password: PASSWORD });
  const auth = { Authorization: `Bearer ${session.body.token}` };
  const profileId = session.body.me.profiles[0].id as number;
  await request(rig.baseUrl).put(`/api/profiles/${profileId}/settings`).set(auth).send(TEST_DOSE_SETTINGS).expect(200);
  await request(rig.baseUrl)
    .post(`/api/profiles/${profileId}/day-kinds`)
    .set(auth)
    .send({ name: 'Rest', isDefault: true, longActingUnits: 14, glucoseUnit: 'mmol_l', timesOfDay: [{ from: '00:00', to: '24:00', carbRatio: 10, correctionFactor: 2 }] })
    .expect(201);
  for (const n of [1, 2]) {
    const d = daysAgo(n);
    await addLogEntries(profileId, [
      { kind: 'reading', at: `${d}T07:50:00Z`, glucoseMmol: 6.1 + n, readingSource: 'typed' },
      { kind: 'meal', at: `${d}T08:00:00Z`, title: `Porridge day ${n}`, mealSource: 'typed', carbAvailableG: 42, carbTotalG: 48 },
      { kind: 'rapid_dose', at: `${d}T08:00:00Z`, units: 4, suggestion: { breakdown: { doseUnits: 4.5 } } },
      { kind: 'reading', at: `${d}T10:30:00Z`, glucoseMmol: 8.4, readingSource: 'typed' },
      { kind: 'meal', at: `${d}T12:30:00Z`, title: 'Lentil soup, bread', mealSource: 'typed', carbAvailableG: 55, carbTotalG: 63 },
      { kind: 'long_dose', at: `${d}T21:00:00Z`, units: 14 },
    ]);
  }
}

describe('logbook in the browser', () => {
  it('wide: History shows the table with the charts beside it; phone: cards (screenshots at 1440 and 390)', async () => {
    const email = 'logbook-history@example.test';
    const wide = await rig.newPage(WIDE);
    await personWithLog(wide, email);

    await wide.getByRole('main').getByText('Logbook', { exact: true }).click();
    await wide.waitForURL(/\/logbook$/);
    const table = wide.getByRole('table', { name: 'Logbook history' });
    await table.getByText('Porridge day 1 · 42 g').waitFor();
    const charts = wide.getByLabel('Charts');
    await charts.getByText('Carbohydrate per day').waitFor();
    await charts.getByText('Time in range').waitFor();
    const [t, c] = [await table.boundingBox(), await charts.boundingBox()];
    expect(c!.x).toBeGreaterThan(t!.x + t!.width - 1); // beside, not below
    expect(c!.y).toBeLessThan(t!.y + t!.height);
    // The meal row: reading before 7.1 (day 1: 6.1 + 1), suggested 4.5, taken 4
    const row = table.getByRole('row').filter({ hasText: 'Porridge day 1' });
    await expect(row.getByText('7.1 mmol/L at 07:50').count()).resolves.toBe(1);
    await expect(row.getByText('4.5 units').count()).resolves.toBe(1);
    await rig.shot(wide, 'wide-history');

    const phone = await rig.newPage(PHONE);
    await phone.goto(`${rig.baseUrl}/sign-in`);
    await phone.getByLabel('Email').fill(email);
    await phone.getByLabel('Password').fill(PASSWORD);
    await phone.getByRole('button', { name: 'Sign in' }).click();
    await phone.waitForURL(`${rig.baseUrl}/`);
    await phone.goto(`${rig.baseUrl}/logbook`);
    await phone.getByRole('list', { name: 'Logbook history' }).getByText('Porridge day 2 · 42 g').waitFor();
    await rig.shot(phone, 'phone-history');
    await phone.getByLabel('Charts').getByText('Rapid-acting insulin per day').scrollIntoViewIfNeeded();
    await rig.shot(phone, 'phone-charts');
  });

  it('import: a file with a bad line shows the line number and imports nothing; a good file imports', async () => {
    const page = await rig.newPage(WIDE);
    await signUpInBrowser(page, rig.baseUrl, { name: 'Ivo', email: 'logbook-import@example.test' });
    await page.goto(`${rig.baseUrl}/logbook/import`);

    await page.getByTestId('readings-file-input').setInputFiles(path.join(FIXTURES, 'readings-bad-line.csv'));
    await page.getByText('Line 4: "high" is not a glucose value.').waitFor();
    await rig.shot(page, 'wide-import-bad-line');

    await page.getByTestId('readings-file-input').setInputFiles(path.join(FIXTURES, 'readings-comma-mgdl.csv'));
    await page.getByRole('table', { name: 'First rows' }).getByText('2026-01-10').first().waitFor();
    await rig.shot(page, 'wide-import-preview');
    await page.getByRole('button', { name: 'Import 3 readings' }).click();
    await page.getByText('3 readings imported, 0 already in the logbook skipped.').waitFor();
    await rig.shot(page, 'wide-import-done');
  });

  it('add a long-acting dose beside its planned units, correct it in History, and read the change before → after', async () => {
    const page = await rig.newPage(WIDE);
    await personWithLog(page, 'logbook-correct@example.test');
    await page.goto(`${rig.baseUrl}/logbook/add`);
    await page.getByRole('radio', { name: 'Long-acting dose' }).click();
    await page.getByText('Planned for Rest: 14 units.').waitFor();
    await page.getByLabel('Long-acting insulin').fill('13');
    await page.getByRole('button', { name: 'Save entry' }).click();
    await page.getByText(/Saved: Long-acting dose 13 units at/).waitFor();
    await rig.shot(page, 'wide-add-entry');

    await page.goto(`${rig.baseUrl}/logbook`);
    const table = page.getByRole('table', { name: 'Logbook history' });
    const added = table.getByRole('rowgroup').filter({ hasText: '13 units' });
    await added.getByRole('button', { name: /^Edit long-acting dose/ }).click();
    await added.getByLabel('Insulin', { exact: true }).fill('12');
    await added.getByRole('button', { name: 'Save correction' }).click();
    const changed = table.getByRole('rowgroup').filter({ hasText: 'changed' });
    await changed.getByText(/12 units.* · changed/).waitFor();
    await changed.getByRole('button', { name: /^Changes to long-acting dose/ }).click();
    const change = changed.getByRole('list', { name: 'Changes to this entry' }).getByRole('listitem');
    await change.getByText(/^Edited by Lena, .* 13 units → .* 12 units$/).waitFor();
    await rig.shot(page, 'wide-entry-changes');
  });
});
