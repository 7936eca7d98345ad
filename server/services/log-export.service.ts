import { minutesToTime } from '../../shared/schemas/profile-settings';
import { stringify } from 'csv-stringify/sync';
import { Op } from 'sequelize';
import { glucoseFromMmol } from '../../shared/compute/units';
import { LOG_KIND_WORDS, type LogPeriodQuery } from '../../shared/schemas/logbook-read';
import type { GlucoseUnit } from '../../shared/schemas/units';
import { LogEntryModel } from '../models';
import { LOG_ENTRY_INCLUDE } from './log-view';
import { loadProfile } from './profiles.service';

const GLUCOSE_HEADER: Record<GlucoseUnit, string> = { mmol_l: 'Glucose (mmol/L)', mg_dl: 'Glucose (mg/dL)' };

/** The columns of the logbook export, units in the headers (README, data formats). */
export function exportHeaders(unit: GlucoseUnit): string[] {
  return [
    'Date (local)',
    'Time (local)',
    'Time zone',
    'Time (UTC)',
    'Entry',
    'Day kind',
    'Meal',
    'Carbohydrate available (g)',
    'Carbohydrate total (g)',
    GLUCOSE_HEADER[unit],
    'Reading source',
    'Rapid-acting insulin (units)',
    'Long-acting insulin (units)',
    'Exercise intensity',
    'Exercise duration (min)',
    'Note',
    'Entered by',
  ];
}

/** Text a spreadsheet would run as a formula gets a leading apostrophe (OWASP, CSV injection). */
const text = (v: string | null) => (v && /^[=+\-@\t\r]/.test(v) ? `'${v}` : (v ?? ''));
const num = (v: number | null, digits = 2) => (v == null ? '' : String(Math.round(v * 10 ** digits) / 10 ** digits));

/** The logbook of a period (local dates) as CSV: UTF-8 with a byte-order mark, comma separated, RFC 4180 quoting. */
export async function exportLogCsv(profileId: number, q: LogPeriodQuery): Promise<{ csv: string; filename: string }> {
  const profile = await loadProfile(profileId);
  const rows = await LogEntryModel.findAll({
    where: { profileId, deletedAt: null, localDate: { [Op.between]: [q.from, q.to] } },
    include: LOG_ENTRY_INCLUDE,
    order: [['occurredAt', 'ASC'], ['id', 'ASC']],
  });
  const unit = profile.glucoseUnit;
  const records = rows.map((r) => [
    r.localDate,
    minutesToTime(r.localMinute),
    r.timeZone,
    r.occurredAt.toISOString(),
    LOG_KIND_WORDS[r.kind],
    text(r.dayKind?.name ?? null),
    r.kind === 'meal' ? text(r.title) : '',
    num(r.carbAvailableG, 1),
    num(r.carbTotalG, 1),
    r.glucoseMmol == null ? '' : num(glucoseFromMmol(r.glucoseMmol, unit), unit === 'mmol_l' ? 1 : 0),
    r.readingSource ?? '',
    r.kind === 'rapid_dose' ? num(r.units) : '',
    r.kind === 'long_dose' ? num(r.units) : '',
    r.intensity ?? '',
    r.durationMinutes == null ? '' : String(r.durationMinutes),
    text(r.note),
    text(r.enteredBy?.displayName ?? null),
  ]);
  const csv = stringify([exportHeaders(unit), ...records], { bom: true, record_delimiter: 'windows' });
  return { csv, filename: `logbook-${q.from}-to-${q.to}.csv` };
}
