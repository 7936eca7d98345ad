import { spawn } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { FoodModel, UserModel } from '../../server/models';
import { diffImport, type StoredFood } from '../../server/importers/import-diff';
import type { FoodInput } from '../../server/importers/dataset';
import { ImportNeedsConfirmation, runImport } from '../../server/services/imports.service';
import { emptyNutrients, type Nutrients } from '../../shared/compute/nutrients';
import { bearer, signUpUser, useTestApp } from '../helpers/api';
import { workerDatabaseUrl } from '../helpers/db';

// The full SR28 import in a child process reads 8,789 foods; on a busy 2-core machine that takes a while.
jest.setTimeout(240_000);

const dataDir = process.env.CARBWRIGHT_SAMPLE_DATA ?? path.resolve(__dirname, '../../../shared/data');
const fdcDir = path.join(dataDir, 'fdc-csv-sample');
const sr28FullDir = path.join(dataDir, 'sr28-full');
const hasFdc = fs.existsSync(path.join(fdcDir, 'food_nutrient.csv'));
const hasSr28Full = fs.existsSync(path.join(sr28FullDir, 'NUT_DATA.txt'));
if (!hasFdc) console.warn(`Import guard tests on the FDC sample skipped: ${fdcDir} not found (set CARBWRIGHT_SAMPLE_DATA).`);
if (!hasSr28Full) console.warn(`Killed-import test skipped: ${sr28FullDir} not found (set CARBWRIGHT_SAMPLE_DATA).`);

const ctx = useTestApp();

const values = (v: Partial<Nutrients>): Nutrients => ({ ...emptyNutrients(), ...v });
const incoming = (code: string, nutrients: Nutrients, hash = `h-${code}-new`) => ({
  input: { sourceCode: code, name: `Food ${code}`, nutrients } as FoodInput,
  hash,
});
const stored = (code: string, nutrients: Nutrients, hash = `h-${code}`): [string, StoredFood] => [code, { code, name: `Food ${code}`, hash, nutrients }];

describe('diffImport', () => {
  const four = values({ energyKcal: 89, carbTotal: 22.84, fibre: 2.6, protein: 1.09 });
  const cases = [
    { name: 'a new food is added', before: [], after: [incoming('1', four)], expected: { added: 1, changed: 0, emptied: 0, unchanged: 0 } },
    { name: 'the same row is unchanged', before: [stored('1', four, 'same')], after: [incoming('1', four, 'same')], expected: { added: 0, changed: 0, emptied: 0, unchanged: 1 } },
    { name: 'one value moving is a change', before: [stored('1', four)], after: [incoming('1', { ...four, carbTotal: 23 })], expected: { added: 0, changed: 1, emptied: 0, unchanged: 0 } },
    { name: 'losing 2 of 4 values is not most', before: [stored('1', four)], after: [incoming('1', { ...four, fibre: null, protein: null })], expected: { added: 0, changed: 1, emptied: 0, unchanged: 0 } },
    { name: 'losing 3 of 4 values empties', before: [stored('1', four)], after: [incoming('1', values({ energyKcal: 89 }))], expected: { added: 0, changed: 1, emptied: 1, unchanged: 0 } },
    { name: 'a stored food with no values left empties', before: [stored('1', four)], after: [incoming('1', emptyNutrients())], expected: { added: 0, changed: 1, emptied: 1, unchanged: 0 } },
    { name: 'a new food without any value empties', before: [], after: [incoming('1', emptyNutrients())], expected: { added: 1, changed: 0, emptied: 1, unchanged: 0 } },
  ];
  it.each(cases)('$name', ({ before, after, expected }) => {
    const diff = diffImport(new Map(before), after);
    expect({ added: diff.added.count, changed: diff.changed.count, emptied: diff.emptied.count, unchanged: diff.unchanged }).toEqual(expected);
  });

  it('names the values a change moves and the values an emptied food loses', () => {
    const diff = diffImport(new Map([stored('1', four)]), [incoming('1', values({ energyKcal: 90 }))]);
    expect(diff.changed.examples[0].fields).toEqual([
      { key: 'energyKcal', from: 89, to: 90 },
      { key: 'carbTotal', from: 22.84, to: null },
      { key: 'fibre', from: 2.6, to: null },
      { key: 'protein', from: 1.09, to: null },
    ]);
    expect(diff.emptied.examples[0]).toMatchObject({ code: '1', reason: 'loses most values', lost: ['carbTotal', 'fibre', 'protein'] });
  });
});

/** A copy of the FDC sample whose food_nutrient.csv ends, cleanly at a line end, after `keep` of its lines. */
function truncatedFdcCopy(keep: number): string {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'cw-fdc-cut-'));
  for (const name of fs.readdirSync(fdcDir)) fs.copyFileSync(path.join(fdcDir, name), path.join(dir, name));
  const lines = fs.readFileSync(path.join(fdcDir, 'food_nutrient.csv'), 'utf8').split('\n');
  fs.writeFileSync(path.join(dir, 'food_nutrient.csv'), `${lines.slice(0, keep).join('\n')}\n`);
  return dir;
}

const snapshot = async () => FoodModel.findAll({ where: { source: 'usda_fdc' }, order: [['sourceCode', 'ASC']], raw: true });

(hasFdc ? describe : describe.skip)('a USDA re-import from a food_nutrient.csv cut at a line end', () => {
  let cut: string;
  beforeAll(async () => {
    await runImport(ctx.sequelize, 'fdc', fdcDir);
    cut = truncatedFdcCopy(800);
  });
  afterAll(() => fs.rmSync(cut, { recursive: true, force: true }));

  it('previews the diff (added, changed, emptied) and writes nothing', async () => {
    const before = await snapshot();

    const preview = await runImport(ctx.sequelize, 'fdc', cut, { preview: true });

    expect(preview.status).toBe('previewed');
    const diff = preview.report.diff as { added: { count: number }; changed: { count: number }; emptied: { count: number; examples: { reason: string }[] } };
    expect(diff.added.count).toBe(0);
    expect(diff.emptied.count).toBeGreaterThan(0);
    expect(diff.changed.count).toBeGreaterThanOrEqual(diff.emptied.count);
    expect(diff.emptied.examples.every((f) => f.reason === 'no values in the files' || f.reason === 'loses most values')).toBe(true);
    expect(await snapshot()).toEqual(before);
  });

  it('stops, reports the emptied foods and changes nothing unless confirmed', async () => {
    const before = await snapshot();

    const stopped = await runImport(ctx.sequelize, 'fdc', cut).catch((err: unknown) => err);

    expect(stopped).toBeInstanceOf(ImportNeedsConfirmation);
    expect((stopped as Error).message).toMatch(/would lose most of their values/);
    expect(await snapshot()).toEqual(before);
    const [record] = await ctx.sequelize.query("SELECT status, report FROM dataset_imports WHERE dataset = 'usda_fdc' ORDER BY id DESC LIMIT 1", { plain: false, raw: true });
    const row = (record as { status: string; report: { needsConfirmation?: boolean; diff?: { emptied: { count: number } } } }[])[0];
    expect(row.status).toBe('failed');
    expect(row.report.needsConfirmation).toBe(true);
    expect(row.report.diff!.emptied.count).toBeGreaterThan(0);
  });

  it('applies when confirmed, blanking exactly the foods the diff named', async () => {
    const preview = await runImport(ctx.sequelize, 'fdc', cut, { preview: true });
    const emptied = (preview.report.diff as { emptied: { count: number } }).emptied.count;

    const done = await runImport(ctx.sequelize, 'fdc', cut, { confirm: true });

    expect(done.status).toBe('succeeded');
    expect(done.report.confirmed).toBe(true);
    const blank = await FoodModel.count({ where: { source: 'usda_fdc', carbTotal: null, energyKcal: null, protein: null } });
    expect(blank).toBeLessThanOrEqual(emptied);
    expect(blank).toBeGreaterThan(0);
    // Put the whole sample back for the API test below (a full file blanks nothing).
    expect((await runImport(ctx.sequelize, 'fdc', fdcDir)).status).toBe('succeeded');
  });

  it('previews through the admin import API (`mode=preview`) and stops without `confirm=true`', async () => {
    const admin = await signUpUser(ctx.app, 'Admin');
    await UserModel.update({ role: 'admin' }, { where: { id: admin.me.user.id } });
    const upload = (fields: Record<string, string>) => {
      let req = request(ctx.app).post('/api/admin/imports').set(bearer(admin.token)).field('kind', 'fdc');
      for (const [k, v] of Object.entries(fields)) req = req.field(k, v);
      for (const name of ['food.csv', 'nutrient.csv', 'food_nutrient.csv', 'food_portion.csv', 'measure_unit.csv', 'food_category.csv', 'sr_legacy_food.csv']) {
        req = req.attach('files', fs.readFileSync(path.join(cut, name)), name);
      }
      return req;
    };
    const finished = async (id: number) => {
      for (let i = 0; i < 300; i += 1) {
        const res = await request(ctx.app).get(`/api/admin/imports/${id}`).set(bearer(admin.token));
        if (res.body.import.status !== 'running') return res.body.import;
        await new Promise((r) => setTimeout(r, 100));
      }
      throw new Error('import did not finish');
    };
    const before = await snapshot();

    const preview = await finished((await upload({ mode: 'preview' })).body.import.id);
    const applied = await finished((await upload({})).body.import.id);

    expect(preview.status).toBe('previewed');
    expect(preview.report.diff.emptied.count).toBeGreaterThan(0);
    expect(applied.status).toBe('failed');
    expect(applied.report.needsConfirmation).toBe(true);
    expect(await snapshot()).toEqual(before);
  });
});

(hasSr28Full ? describe : describe.skip)('an import killed while it writes', () => {
  it('leaves no food half-written, and the rerun completes', async () => {
    const env = { ...process.env, DATABASE_URL: workerDatabaseUrl(), LOG_LEVEL: 'silent' };
    const tsx = path.resolve(__dirname, '../../node_modules/.bin/tsx');
    const child = spawn(tsx, [path.resolve(__dirname, '../../server/cli/import.ts'), 'sr28', sr28FullDir], { env, stdio: 'ignore' });
    const exited = new Promise((resolve) => child.once('exit', resolve));

    // Wait until another session's transaction has written (it holds a transaction id), then kill the process hard.
    let writing = false;
    for (let i = 0; i < 6000 && !writing && child.exitCode === null; i += 1) {
      const [rows] = await ctx.sequelize.query(
        'SELECT count(*)::int AS n FROM pg_stat_activity WHERE datname = current_database() AND pid <> pg_backend_pid() AND backend_xid IS NOT NULL',
      );
      writing = (rows as { n: number }[])[0].n > 0;
      if (!writing) await new Promise((r) => setTimeout(r, 20));
    }
    child.kill('SIGKILL');
    await exited;

    expect(writing).toBe(true);
    expect(await FoodModel.count({ where: { source: 'usda_sr28' } })).toBe(0);
    // The killed run's record stays "running"; the rerun is a fresh import that completes.
    const rerun = await runImport(ctx.sequelize, 'sr28', sr28FullDir);
    expect(rerun.status).toBe('succeeded');
    // SR28 documentation (sr28-full README): 8,789 food items.
    expect(await FoodModel.count({ where: { source: 'usda_sr28' } })).toBe(8789);
  });
});
