import { minutesToTime } from '../../shared/schemas/profile-settings';
import { randomUUID } from 'node:crypto';
import { parse } from 'csv-parse/sync';
import { Op } from 'sequelize';
import { columnDateOrder, parseReadingTime, parseReadingValue, type DateOrder } from '../../shared/compute/reading-rows';
import { glucoseFromMmol } from '../../shared/compute/units';
import { toLocalTime } from '../../shared/compute/local-time';
import type {
  ImportedRow,
  ImportRowError,
  ReadingsImportColumns,
  ReadingsImportPreview,
  ReadingsImportResult,
} from '../../shared/schemas/logbook-read';
import { AppError } from '../errors';
import { LogEntryModel } from '../models';
import { listDayKindDays } from './day-kind-days.service';
import { loadProfile } from './profiles.service';

/** Glucose readings from a meter or sensor file: CSV or TSV with a header row, read, checked and stored in one go. */

type Delimiter = ReadingsImportPreview['delimiter'];
const PREVIEW_ROWS = 10;
const ERRORS_LISTED = 50;

/** The text of a file: UTF-8 when it is valid UTF-8 (a byte-order mark is dropped), Latin-1 otherwise. */
export function decodeReadingsFile(bytes: Buffer): { text: string; encoding: 'utf-8' | 'latin-1' } {
  try {
    const text = new TextDecoder('utf-8', { fatal: true }).decode(bytes);
    return { text: text.replace(/^\uFEFF/, ''), encoding: 'utf-8' };
  } catch {
    return { text: bytes.toString('latin1'), encoding: 'latin-1' };
  }
}

/** The separator the header row uses most: tab, semicolon or comma (outside quotes). */
export function detectDelimiter(headerLine: string): Delimiter {
  const unquoted = headerLine.replace(/"[^"]*"/g, '');
  const counts: [Delimiter, number][] = (['\t', ';', ','] as const).map((d) => [d, unquoted.split(d).length - 1]);
  const best = counts.reduce((a, b) => (b[1] > a[1] ? b : a));
  return best[1] > 0 ? best[0] : ',';
}

const GUESS: Record<'timeColumn' | 'valueColumn' | 'unitColumn', RegExp> = {
  timeColumn: /time|date|when|zeit|datum|heure|fecha|hora/i,
  valueColumn: /glucose|value|reading|level|mmol|mg\/dl|sugar|wert|glyc/i,
  unitColumn: /^(unit|units|einheit|unité|unidad)$/i,
};

function guessMapping(columns: string[]): Partial<ReadingsImportColumns> {
  const out: Partial<ReadingsImportColumns> = {};
  for (const key of ['unitColumn', 'timeColumn', 'valueColumn'] as const) {
    const hit = columns.find((c) => GUESS[key].test(c) && !Object.values(out).includes(c));
    if (hit) out[key] = hit;
  }
  return out;
}

type Table = { encoding: 'utf-8' | 'latin-1'; delimiter: Delimiter; columns: string[]; rows: { line: number; cells: string[] }[] };

function readTable(bytes: Buffer): Table {
  const { text, encoding } = decodeReadingsFile(bytes);
  const delimiter = detectDelimiter(text.split(/\r?\n/, 1)[0] ?? '');
  let records: { record: string[]; info: { lines: number } }[];
  try {
    records = parse(text, { delimiter, info: true, relax_column_count: true, skip_empty_lines: true, trim: true }) as unknown as typeof records;
  } catch (e) {
    const line = (e as { lines?: number }).lines;
    throw AppError.unprocessable(`The file could not be read${line ? ` at line ${line}` : ''}: ${(e as Error).message}`, { file: [`Line ${line ?? '?'}: the file could not be read there.`] });
  }
  if (records.length < 2) throw AppError.unprocessable('The file needs a header row and at least one reading.', { file: ['The file needs a header row and at least one reading.'] });
  const [header, ...rest] = records;
  return { encoding, delimiter, columns: header.record, rows: rest.map((r) => ({ line: r.info.lines, cells: r.record })) };
}

type Interpreted = { errors: ImportRowError[]; readings: { line: number; at: number; mmol: number }[]; dateOrderNeeded: boolean };

function interpret(table: Table, mapping: ReadingsImportColumns, zone: string): Interpreted {
  const col = (name: string | undefined) => (name ? table.columns.indexOf(name) : -1);
  const [ti, vi, ui] = [col(mapping.timeColumn), col(mapping.valueColumn), col(mapping.unitColumn)];
  const missing: Record<string, string[]> = {};
  if (ti < 0) missing.timeColumn = [`There is no column "${mapping.timeColumn}".`];
  if (vi < 0) missing.valueColumn = [`There is no column "${mapping.valueColumn}".`];
  if (mapping.unitColumn && ui < 0) missing.unitColumn = [`There is no column "${mapping.unitColumn}".`];
  if (Object.keys(missing).length) throw AppError.validation(missing);
  const order = columnDateOrder(table.rows.map((r) => r.cells[ti] ?? ''));
  const chosen: DateOrder | null = order === 'day_month' || order === 'month_day' ? order : (mapping.dateOrder ?? null);
  const dateOrderNeeded = order === 'ambiguous' && !mapping.dateOrder;
  const errors: ImportRowError[] = [];
  const readings: Interpreted['readings'] = [];
  for (const { line, cells } of table.rows) {
    const time = parseReadingTime(cells[ti] ?? '', zone, chosen);
    const value = parseReadingValue(cells[vi] ?? '', ui >= 0 ? (cells[ui] ?? '') : null, mapping.unit);
    if ('error' in time) errors.push({ line, message: time.error });
    else if ('error' in value) errors.push({ line, message: value.error });
    else readings.push({ line, at: time.at, mmol: value.mmol });
  }
  return { errors, readings, dateOrderNeeded };
}

const dupKey = (at: number, mmol: number) => `${Math.floor(at / 60_000)}|${Math.round(mmol * 10)}`;

/** Marks readings already in the logbook (same minute, same value to 0.1 mmol/L) or earlier in the file. */
async function markDuplicates(profileId: number, readings: Interpreted['readings']) {
  if (!readings.length) return new Set<number>();
  const times = readings.map((r) => r.at);
  const stored = await LogEntryModel.findAll({
    where: { profileId, kind: 'reading', deletedAt: null, occurredAt: { [Op.between]: [new Date(Math.min(...times) - 60_000), new Date(Math.max(...times) + 60_000)] } },
    attributes: ['occurredAt', 'glucoseMmol'],
  });
  const seen = new Set(stored.map((s) => dupKey(s.occurredAt.getTime(), s.glucoseMmol ?? 0)));
  const dups = new Set<number>();
  for (const r of readings) {
    const key = dupKey(r.at, r.mmol);
    if (seen.has(key)) dups.add(r.line);
    seen.add(key);
  }
  return dups;
}


/** Reads a file and answers what an import would store: columns, the mapping (chosen or guessed), first rows, problems. */
export async function previewReadingsImport(profileId: number, bytes: Buffer, chosen: Partial<ReadingsImportColumns>): Promise<ReadingsImportPreview> {
  const profile = await loadProfile(profileId);
  const table = readTable(bytes);
  const mapping = { unit: profile.glucoseUnit, ...guessMapping(table.columns), ...stripEmpty(chosen) };
  const base = {
    encoding: table.encoding,
    delimiter: table.delimiter,
    columns: table.columns,
    mapping,
    timeZone: profile.timeZone,
    glucoseUnit: profile.glucoseUnit,
    rows: table.rows.length,
  };
  if (!mapping.timeColumn || !mapping.valueColumn) return { ...base, dateOrderNeeded: false, firstRows: [], duplicates: 0, errors: [] };
  const result = interpret(table, mapping as ReadingsImportColumns, profile.timeZone);
  if (result.dateOrderNeeded) return { ...base, dateOrderNeeded: true, firstRows: [], duplicates: 0, errors: [] };
  const dups = await markDuplicates(profileId, result.readings);
  const firstRows: ImportedRow[] = result.readings.slice(0, PREVIEW_ROWS).map((r) => {
    const local = toLocalTime(r.at, profile.timeZone);
    return { line: r.line, occurredAt: new Date(r.at).toISOString(), localDate: local.localDate, localTime: minutesToTime(local.localMinute), glucose: glucoseFromMmol(r.mmol, profile.glucoseUnit), duplicate: dups.has(r.line) };
  });
  return { ...base, dateOrderNeeded: false, firstRows, duplicates: dups.size, errors: result.errors.slice(0, ERRORS_LISTED) };
}

function stripEmpty(chosen: Partial<ReadingsImportColumns>): Partial<ReadingsImportColumns> {
  return Object.fromEntries(Object.entries(chosen).filter(([, v]) => v != null && v !== '')) as Partial<ReadingsImportColumns>;
}

/** Imports every reading of the file in one transaction, skipping duplicates; any bad row refuses the whole file. */
export async function importReadings(profileId: number, userId: number, bytes: Buffer, mapping: ReadingsImportColumns): Promise<ReadingsImportResult> {
  const profile = await loadProfile(profileId);
  const table = readTable(bytes);
  const result = interpret(table, stripEmpty(mapping) as ReadingsImportColumns, profile.timeZone);
  if (result.dateOrderNeeded) throw AppError.validation({ dateOrder: ['Choose whether dates are day-month or month-day.'] });
  if (result.errors.length) {
    const first = result.errors[0];
    throw AppError.unprocessable(`Nothing was imported: line ${first.line}: ${first.message}`, {
      file: result.errors.slice(0, ERRORS_LISTED).map((e) => `Line ${e.line}: ${e.message}`),
    });
  }
  return LogEntryModel.sequelize!.transaction(async (transaction) => {
    await loadProfile(profileId, transaction); // lock: two imports of one profile run one after the other
    const dups = await markDuplicates(profileId, result.readings);
    const fresh = result.readings.filter((r) => !dups.has(r.line));
    if (!fresh.length) return { imported: 0, duplicatesSkipped: dups.size, groupKey: null };
    const locals = fresh.map((r) => toLocalTime(r.at, profile.timeZone));
    const dates = locals.map((l) => l.localDate).sort();
    const kinds = new Map((await listDayKindDays(profileId, dates[0], dates[dates.length - 1])).map((d) => [d.date, d.dayKindId]));
    const groupKey = randomUUID();
    const rows = fresh.map((r, i) => ({
      profileId,
      kind: 'reading' as const,
      occurredAt: new Date(r.at),
      localDate: locals[i].localDate,
      localMinute: locals[i].localMinute,
      timeZone: profile.timeZone,
      dayKindId: kinds.get(locals[i].localDate) ?? null,
      groupKey,
      enteredByUserId: userId,
      glucoseMmol: r.mmol,
      readingSource: 'imported' as const,
    }));
    for (let i = 0; i < rows.length; i += 2000) await LogEntryModel.bulkCreate(rows.slice(i, i + 2000), { transaction });
    return { imported: rows.length, duplicatesSkipped: dups.size, groupKey };
  });
}
