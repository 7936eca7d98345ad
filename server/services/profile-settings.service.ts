import type { Transaction } from 'sequelize';
import type { DayKindRatios, DoseSettings } from '../../shared/compute/dose';
import { glucoseFromMmol, glucoseToMmol } from '../../shared/compute/units';
import {
  minutesToTime,
  timeToMinutes,
  type DayKind,
  type DayKindInput,
  type ProfileSettingsInput,
  type ProfileSettingsView,
  type SettingsChange,
} from '../../shared/schemas/profile-settings';
import type { GlucoseUnit } from '../../shared/schemas/units';
import { AppError } from '../errors';
import { DayKindModel, ProfileModel, ProfileSettingsModel, RatioBlockModel, SettingsChangeModel, UserModel } from '../models';

/** A stored mmol/L value in the display unit, trimmed of float noise (display precision is applied later). */
function show(mmol: number, unit: GlucoseUnit): number {
  return Math.round(glucoseFromMmol(mmol, unit) * 1e6) / 1e6;
}

async function loadProfile(profileId: number, transaction?: Transaction) {
  const profile = await ProfileModel.findByPk(profileId, { transaction, lock: transaction ? transaction.LOCK.UPDATE : undefined });
  if (!profile) throw AppError.notFound('profile');
  return profile;
}

function toView(profile: ProfileModel, row: ProfileSettingsModel | null): ProfileSettingsView {
  const u = profile.glucoseUnit;
  return {
    glucoseUnit: u,
    carbBasis: profile.carbBasis,
    carbUnit: profile.carbUnit,
    preferredFoodTable: profile.preferredFoodTable,
    settings: row && {
      penIncrement: row.penIncrement,
      rounding: row.rounding,
      maxDoseUnits: row.maxDoseUnits,
      actionTimeHours: row.actionTimeHours,
      targetLow: show(row.targetLowMmol, u),
      targetHigh: show(row.targetHighMmol, u),
      correctionTarget: show(row.correctionTargetMmol, u),
      hypoThreshold: show(row.hypoThresholdMmol, u),
      veryHigh: show(row.veryHighMmol, u),
      allowNegativeCorrection: row.allowNegativeCorrection,
      iobConvention: row.iobConvention,
      exerciseReductions: row.exerciseReductions,
    },
    updatedAt: row ? row.updatedAt.toISOString() : null,
  };
}

/** The profile's units and dose settings (settings is null until set up). */
export async function getSettings(profileId: number): Promise<ProfileSettingsView> {
  const profile = await loadProfile(profileId);
  return toView(profile, await ProfileSettingsModel.findByPk(profileId));
}

/** Saves units and safety limits in one transaction and records the change (old and new values). */
export async function updateSettings(profileId: number, userId: number, input: ProfileSettingsInput): Promise<ProfileSettingsView> {
  const sequelize = ProfileModel.sequelize!;
  return sequelize.transaction(async (transaction) => {
    const profile = await loadProfile(profileId, transaction);
    const existing = await ProfileSettingsModel.findByPk(profileId, { transaction });
    const before = toView(profile, existing);
    const u = input.glucoseUnit;
    await profile.update(
      { glucoseUnit: u, carbBasis: input.carbBasis, carbUnit: input.carbUnit, preferredFoodTable: input.preferredFoodTable ?? profile.preferredFoodTable },
      { transaction },
    );
    const values = {
      profileId,
      penIncrement: input.penIncrement,
      rounding: input.rounding,
      maxDoseUnits: input.maxDoseUnits,
      actionTimeHours: input.actionTimeHours,
      targetLowMmol: glucoseToMmol(input.targetLow, u),
      targetHighMmol: glucoseToMmol(input.targetHigh, u),
      correctionTargetMmol: glucoseToMmol(input.correctionTarget, u),
      hypoThresholdMmol: glucoseToMmol(input.hypoThreshold, u),
      veryHighMmol: glucoseToMmol(input.veryHigh, u),
      allowNegativeCorrection: input.allowNegativeCorrection,
      iobConvention: input.iobConvention,
      exerciseReductions: input.exerciseReductions,
      updatedByUserId: userId,
    };
    const row = existing ? await existing.update(values, { transaction }) : await ProfileSettingsModel.create(values, { transaction });
    const after = toView(profile, row);
    await recordChange(
      { profileId, userId, subject: 'settings', subjectId: null, subjectName: 'Units and safety limits', action: existing ? 'updated' : 'created' },
      { ...before, updatedAt: undefined },
      { ...after, updatedAt: undefined },
      transaction,
    );
    return after;
  });
}

function dayKindToView(kind: DayKindModel, unit: GlucoseUnit): DayKind {
  const blocks = [...(kind.blocks ?? [])].sort((a, b) => a.startMinute - b.startMinute);
  return {
    id: kind.id,
    name: kind.name,
    isDefault: kind.isDefault,
    longActingUnits: kind.longActingUnits,
    glucoseUnit: unit,
    blocks: blocks.map((b) => ({
      from: minutesToTime(b.startMinute),
      to: minutesToTime(b.endMinute),
      carbRatio: b.carbRatio,
      correctionFactor: show(b.correctionFactorMmol, unit),
    })),
    updatedAt: kind.updatedAt.toISOString(),
  };
}

const withBlocks = { include: [{ model: RatioBlockModel, as: 'blocks' }] };

/** The profile's day kinds, default first, each with its blocks in the profile's glucose unit. */
export async function listDayKinds(profileId: number): Promise<DayKind[]> {
  const profile = await loadProfile(profileId);
  const kinds = await DayKindModel.findAll({ where: { profileId }, ...withBlocks, order: [['isDefault', 'DESC'], ['name', 'ASC']] });
  return kinds.map((k) => dayKindToView(k, profile.glucoseUnit));
}

async function findDayKind(profileId: number, dayKindId: number, transaction?: Transaction) {
  const kind = await DayKindModel.findOne({ where: { id: dayKindId, profileId }, ...withBlocks, transaction });
  if (!kind) throw AppError.notFound('day kind');
  return kind;
}

async function assertNameFree(profileId: number, name: string, exceptId: number | null, transaction: Transaction) {
  const kinds = await DayKindModel.findAll({ where: { profileId }, transaction });
  if (kinds.some((k) => k.id !== exceptId && k.name.toLowerCase() === name.toLowerCase())) {
    throw AppError.conflict('There is already a day kind with that name.', { name: ['Choose a name not used yet.'] });
  }
  return kinds;
}

async function writeBlocks(kind: DayKindModel, input: DayKindInput, transaction: Transaction) {
  await RatioBlockModel.destroy({ where: { dayKindId: kind.id }, transaction });
  await RatioBlockModel.bulkCreate(
    input.blocks.map((b) => ({
      dayKindId: kind.id,
      startMinute: timeToMinutes(b.from),
      endMinute: timeToMinutes(b.to),
      carbRatio: b.carbRatio,
      correctionFactorMmol: glucoseToMmol(b.correctionFactor, input.glucoseUnit),
    })),
    { transaction },
  );
}

function stripTime(kind: DayKind | null) {
  if (!kind) return null;
  const { updatedAt: _ignored, id: _id, ...rest } = kind;
  return rest;
}

/** Creates a day kind with its blocks; the first day kind of a profile becomes its default. */
export async function createDayKind(profileId: number, userId: number, input: DayKindInput): Promise<DayKind> {
  return ProfileModel.sequelize!.transaction(async (transaction) => {
    const profile = await loadProfile(profileId, transaction);
    const others = await assertNameFree(profileId, input.name, null, transaction);
    const isDefault = input.isDefault || others.length === 0;
    if (isDefault) await DayKindModel.update({ isDefault: false }, { where: { profileId }, transaction });
    const kind = await DayKindModel.create({ profileId, name: input.name, isDefault, longActingUnits: input.longActingUnits }, { transaction });
    await writeBlocks(kind, input, transaction);
    const view = dayKindToView(await findDayKind(profileId, kind.id, transaction), profile.glucoseUnit);
    await recordChange({ profileId, userId, subject: 'day_kind', subjectId: kind.id, subjectName: kind.name, action: 'created' }, null, stripTime(view), transaction);
    return view;
  });
}

/** Replaces a day kind's name, default flag, long-acting dose and blocks, and records the change. */
export async function updateDayKind(profileId: number, dayKindId: number, userId: number, input: DayKindInput): Promise<DayKind> {
  return ProfileModel.sequelize!.transaction(async (transaction) => {
    const profile = await loadProfile(profileId, transaction);
    const kind = await findDayKind(profileId, dayKindId, transaction);
    const before = dayKindToView(kind, profile.glucoseUnit);
    await assertNameFree(profileId, input.name, kind.id, transaction);
    if (kind.isDefault && !input.isDefault) {
      throw AppError.validation({ isDefault: ['Make another day kind the default instead.'] });
    }
    if (input.isDefault && !kind.isDefault) await DayKindModel.update({ isDefault: false }, { where: { profileId }, transaction });
    await kind.update({ name: input.name, isDefault: input.isDefault, longActingUnits: input.longActingUnits }, { transaction });
    kind.changed('updatedAt', true);
    await kind.save({ transaction });
    await writeBlocks(kind, input, transaction);
    const after = dayKindToView(await findDayKind(profileId, kind.id, transaction), profile.glucoseUnit);
    await recordChange({ profileId, userId, subject: 'day_kind', subjectId: kind.id, subjectName: input.name, action: 'updated' }, stripTime(before), stripTime(after), transaction);
    return after;
  });
}

/** Deletes a day kind; the default can only go when it is the last one. */
export async function deleteDayKind(profileId: number, dayKindId: number, userId: number): Promise<void> {
  await ProfileModel.sequelize!.transaction(async (transaction) => {
    const profile = await loadProfile(profileId, transaction);
    const kind = await findDayKind(profileId, dayKindId, transaction);
    const count = await DayKindModel.count({ where: { profileId }, transaction });
    if (kind.isDefault && count > 1) throw AppError.conflict('Make another day kind the default before deleting this one.');
    const before = dayKindToView(kind, profile.glucoseUnit);
    await kind.destroy({ transaction });
    await recordChange({ profileId, userId, subject: 'day_kind', subjectId: kind.id, subjectName: kind.name, action: 'deleted' }, stripTime(before), null, transaction);
  });
}

type ChangeHead = Pick<SettingsChangeModel, 'profileId' | 'userId' | 'subject' | 'subjectId' | 'subjectName' | 'action'>;

async function recordChange(head: ChangeHead, oldValue: object | null, newValue: object | null, transaction: Transaction) {
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
  'actionTimeHours', 'targetLow', 'targetHigh', 'correctionTarget', 'hypoThreshold', 'veryHigh', 'allowNegativeCorrection',
  'iobConvention', 'exerciseReductions', 'light', 'moderate', 'hard', 'min30', 'min60', 'blocks', 'from', 'to', 'carbRatio', 'correctionFactor',
];
function fieldRank(path: string): number[] {
  return path.split('.').map((p) => (/^\d+$/.test(p) ? Number(p) : FIELD_ORDER.indexOf(p) + 1000));
}
function compareRanks(a: number[], b: number[]): number {
  for (let i = 0; i < Math.min(a.length, b.length); i++) if (a[i] !== b[i]) return a[i] - b[i];
  return a.length - b.length;
}

/** Field-by-field differences between two stored values (dot paths, e.g. "blocks.0.carbRatio"), in screen order. */
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

/** The engine's inputs for a profile: settings (mmol/L) and the chosen or default day kind; null parts when not set up. */
export async function loadDoseContext(
  profileId: number,
  dayKindId?: number | null,
): Promise<{ profile: ProfileModel; settings: DoseSettings | null; dayKind: DayKindRatios | null }> {
  const profile = await loadProfile(profileId);
  const row = await ProfileSettingsModel.findByPk(profileId);
  const where = dayKindId ? { profileId, id: dayKindId } : { profileId, isDefault: true };
  const kind = await DayKindModel.findOne({ where, ...withBlocks });
  if (dayKindId && !kind) throw AppError.validation({ dayKindId: ['That day kind is not on this profile.'] });
  const settings: DoseSettings | null = row && {
    penIncrement: row.penIncrement,
    rounding: row.rounding,
    maxDoseUnits: row.maxDoseUnits,
    actionTimeHours: row.actionTimeHours,
    targetLowMmol: row.targetLowMmol,
    targetHighMmol: row.targetHighMmol,
    correctionTargetMmol: row.correctionTargetMmol,
    hypoThresholdMmol: row.hypoThresholdMmol,
    veryHighMmol: row.veryHighMmol,
    allowNegativeCorrection: row.allowNegativeCorrection,
    iobConvention: row.iobConvention,
    exerciseReductions: row.exerciseReductions,
  };
  const dayKind: DayKindRatios | null = kind && {
    id: kind.id,
    name: kind.name,
    blocks: (kind.blocks ?? []).map((b) => ({
      startMinute: b.startMinute,
      endMinute: b.endMinute,
      carbRatio: b.carbRatio,
      correctionFactorMmol: b.correctionFactorMmol,
    })),
  };
  return { profile, settings, dayKind };
}
