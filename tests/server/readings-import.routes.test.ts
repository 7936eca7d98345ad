import fs from 'node:fs';
import path from 'node:path';
import request from 'supertest';
import { LogEntryModel, ProfileAccessModel } from '../../server/models';
import { bearer, signUpMember, signUpUser, useTestApp } from '../helpers/api';
import { setProfileTimeZone } from '../helpers/logbook';

const ctx = useTestApp();
const FIXTURES = path.join(__dirname, '..', 'fixtures', 'readings');
const file = (name: string) => fs.readFileSync(path.join(FIXTURES, name));

function send(url: string, token: string, name: string, fields: Record<string, string> = {}, bytes = file(name)) {
  let req = request(ctx.app).post(`/api${url}`).set(bearer(token));
  for (const [k, v] of Object.entries(fields)) req = req.field(k, v);
  return req.attach('file', bytes, name);
}

async function member(zone = 'Europe/Berlin') {
  const m = await signUpMember(ctx.app, 'Importer');
  await setProfileTimeZone(m.profileId, zone);
  return { ...m, preview: `/profiles/${m.profileId}/logbook/readings-import/preview`, commit: `/profiles/${m.profileId}/logbook/readings-import` };
}

const stored = (profileId: number) => LogEntryModel.findAll({ where: { profileId }, order: [['occurredAt', 'ASC']] });

describe('POST /api/profiles/:profileId/logbook/readings-import/preview', () => {
  it('reads a Latin-1, semicolon, decimal-comma file and guesses the columns; times are Berlin time', async () => {
    const m = await member();
    const res = await send(m.preview, m.token, 'readings-semicolon-latin1.csv').expect(200);

    expect(res.body).toMatchObject({
      encoding: 'latin-1',
      delimiter: ';',
      columns: ['Messzeit', 'Glukosewert', 'Bemerkung'],
      mapping: { timeColumn: 'Messzeit', valueColumn: 'Glukosewert', unit: 'mmol_l' },
      dateOrderNeeded: false,
      rows: 3,
      errors: [],
    });
    // 10.01.2026 07:45 in Berlin (CET, UTC+1 in winter) is 06:45 UTC; "5,6" is 5.6 (by hand). Line 2: after the header.
    expect(res.body.firstRows[0]).toEqual({ line: 2, occurredAt: '2026-01-10T06:45:00.000Z', localDate: '2026-01-10', localTime: '07:45', glucose: 5.6, duplicate: false });
  });

  it('asks for the date order when every date fits both, and reads it once chosen', async () => {
    const m = await member('UTC');
    const first = await send(m.preview, m.token, 'readings-tab-ambiguous.tsv').expect(200);
    const dayMonth = await send(m.preview, m.token, 'readings-tab-ambiguous.tsv', { dateOrder: 'day_month' }).expect(200);
    const monthDay = await send(m.preview, m.token, 'readings-tab-ambiguous.tsv', { dateOrder: 'month_day' }).expect(200);

    expect(first.body).toMatchObject({ delimiter: '\t', dateOrderNeeded: true, firstRows: [] });
    // 03/04/2026 is 3 April read day-month, 4 March read month-day; 9:45 PM is 21:45.
    expect(dayMonth.body.firstRows.map((r: { localDate: string; localTime: string }) => `${r.localDate} ${r.localTime}`)).toEqual(['2026-04-03 07:30', '2026-04-03 21:45']);
    expect(monthDay.body.firstRows.map((r: { localDate: string }) => r.localDate)).toEqual(['2026-03-04', '2026-03-04']);
  });
});

describe('POST /api/profiles/:profileId/logbook/readings-import', () => {
  it('imports mg/dL and mmol/L rows, zone-less times in the profile zone, and skips them the second time', async () => {
    const m = await member();
    const fields = { timeColumn: 'Time', valueColumn: 'Glucose', unitColumn: 'Unit', unit: 'mmol_l' };

    const res = await send(m.commit, m.token, 'readings-comma-mgdl.csv', fields).expect(201);
    const again = await send(m.commit, m.token, 'readings-comma-mgdl.csv', fields).expect(201);
    const rows = await stored(m.profileId);

    expect(res.body).toMatchObject({ imported: 3, duplicatesSkipped: 0 });
    expect(again.body).toMatchObject({ imported: 0, duplicatesSkipped: 3 });
    // 108 mg/dL ÷ 18.0156 = 5.9948 mmol/L (check-values.md, glucose conversion); 06:30Z is 07:30 in Berlin.
    // "2026-01-10 09:15" has no zone: Berlin 09:15 is 08:15 UTC.
    expect(rows.map((r) => [r.occurredAt.toISOString(), r.localDate, r.localMinute, r.readingSource])).toEqual([
      ['2026-01-10T06:30:00.000Z', '2026-01-10', 7 * 60 + 30, 'imported'],
      ['2026-01-10T08:15:00.000Z', '2026-01-10', 9 * 60 + 15, 'imported'],
      ['2026-01-10T11:00:00.000Z', '2026-01-10', 12 * 60, 'imported'],
    ]);
    expect(rows[0].glucoseMmol).toBeCloseTo(5.9948, 4);
    expect(rows[1].glucoseMmol).toBe(7.4);
    expect(rows.every((r) => r.timeZone === 'Europe/Berlin' && r.kind === 'reading')).toBe(true);
  });

  it('reports a bad row by its line and imports nothing', async () => {
    const m = await member();
    const res = await send(m.commit, m.token, 'readings-bad-line.csv', { timeColumn: 'Time', valueColumn: 'Glucose', unit: 'mmol_l' });

    expect(res.status).toBe(422);
    expect(res.body.error.message).toMatch(/line 4/);
    expect(res.body.error.fieldErrors.file).toEqual(['Line 4: "high" is not a glucose value.']);
    expect(await stored(m.profileId)).toHaveLength(0);
  });

  it('refuses an ambiguous file without a date order, a file over 10 MB, and a clinician', async () => {
    const m = await member();
    const clinician = await signUpUser(ctx.app, 'Clinic');
    await ProfileAccessModel.create({ profileId: m.profileId, userId: clinician.me.user.id, role: 'clinician' });
    const fields = { timeColumn: 'when', valueColumn: 'reading mmol', unit: 'mmol_l' };
    const big = Buffer.concat([Buffer.from('Time,Glucose\n'), Buffer.alloc(10 * 1024 * 1024, 'x')]);

    const ambiguous = await send(m.commit, m.token, 'readings-tab-ambiguous.tsv', fields);
    const tooBig = await send(m.commit, m.token, 'big.csv', fields, big);
    const notAllowed = await send(m.commit, clinician.token, 'readings-tab-ambiguous.tsv', { ...fields, dateOrder: 'day_month' });

    expect(ambiguous.status).toBe(400);
    expect(ambiguous.body.error.fieldErrors.dateOrder).toBeDefined();
    expect(tooBig.status).toBe(400);
    expect(tooBig.body.error.fieldErrors.file[0]).toMatch(/10 MB/);
    expect(notAllowed.status).toBe(403);
    expect(await stored(m.profileId)).toHaveLength(0);
  });
});
