import type { Transaction } from 'sequelize';
import type { SettingsChange } from '../../shared/schemas/profile-settings';
import { SettingsChangeModel, UserModel } from '../models';
import { loadProfile } from './profiles.service';

export type ChangeHead = Pick<SettingsChangeModel, 'profileId' | 'userId' | 'subject' | 'subjectId' | 'subjectName' | 'action'>;

/** Records one change to settings or a day kind (old and new values, who made it) in the caller's transaction. */
export async function recordChange(head: ChangeHead, oldValue: object | null, newValue: object | null, transaction: Transaction) {
  await SettingsChangeModel.create(
    { ...head, oldValue: oldValue && JSON.parse(JSON.stringify(oldValue)), newValue: newValue && JSON.parse(JSON.stringify(newValue)) },
    { transaction },
  );
}

function flatten(value: unknown, prefix = '', out: Record<string, unknown> = {}): Record<string, unknown> {
  if (value && typeof value === 'object') {
    for (const [k, v] of Object.entries(value)) flatten(v, prefix ? `${prefix}.${k}` : k, out);
  } else if (prefix) out[prefix] = value ?? null;
  return out;
}

// PostgreSQL's jsonb reorders keys, so changes are listed in the order the screens show the fields.
const FIELD_ORDER = [
  'name', 'isDefault', 'longActingUnits', 'glucoseUnit', 'carbBasis', 'carbUnit', 'preferredFoodTable', 'penIncrement', 'rounding', 'maxDoseUnits',
  'actionTimeHours', 'activeInsulinModel', 'targetLow', 'targetHigh', 'correctionTarget', 'hypoThreshold', 'veryHigh', 'allowNegativeCorrection',
  'iobConvention', 'exerciseReductions', 'light', 'moderate', 'hard', 'min30', 'min60', 'timesOfDay', 'from', 'to', 'carbRatio', 'correctionFactor',
];
function fieldRank(path: string): number[] {
  return path.split('.').map((p) => (/^\d+$/.test(p) ? Number(p) : FIELD_ORDER.indexOf(p) + 1000));
}
function compareRanks(a: number[], b: number[]): number {
  for (let i = 0; i < Math.min(a.length, b.length); i++) if (a[i] !== b[i]) return a[i] - b[i];
  return a.length - b.length;
}

/** Field-by-field differences between two stored values (dot paths, e.g. "timesOfDay.0.carbRatio"), in screen order. */
export function diffValues(oldValue: unknown, newValue: unknown): SettingsChange['changes'] {
  const a = flatten(oldValue);
  const b = flatten(newValue);
  const keys = [...new Set([...Object.keys(a), ...Object.keys(b)])].sort((x, y) => compareRanks(fieldRank(x), fieldRank(y)));
  return keys.filter((k) => JSON.stringify(a[k]) !== JSON.stringify(b[k])).map((k) => ({ field: k, from: a[k] ?? null, to: b[k] ?? null }));
}

/** Every change to the profile's settings and day kinds, newest first, with who made it. */
export async function listChanges(profileId: number, limit = 200): Promise<SettingsChange[]> {
  await loadProfile(profileId);
  const rows = await SettingsChangeModel.findAll({
    where: { profileId },
    include: [{ model: UserModel, as: 'user', attributes: ['id', 'displayName'] }],
    order: [['createdAt', 'DESC'], ['id', 'DESC']],
    limit,
  });
  return rows.map((r) => {
    const user = (r as SettingsChangeModel & { user?: UserModel | null }).user;
    return {
      id: r.id,
      subject: r.subject,
      subjectId: r.subjectId,
      subjectName: r.subjectName,
      action: r.action,
      changedBy: { id: r.userId, displayName: user?.displayName ?? 'A removed account' },
      createdAt: r.createdAt.toISOString(),
      changes: diffValues(r.oldValue, r.newValue),
    };
  });
}

