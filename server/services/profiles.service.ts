import type { Transaction } from 'sequelize';
import { glucoseFromMmol } from '../../shared/compute/units';
import type { CarbBasis, CarbUnit, GlucoseUnit } from '../../shared/schemas/units';
import { AppError } from '../errors';
import { remember } from '../lib/request-cache';
import { ProfileModel } from '../models';

/** A stored mmol/L value in the display unit, trimmed of float noise (display precision is applied later). */
export function show(mmol: number, unit: GlucoseUnit): number {
  return Math.round(glucoseFromMmol(mmol, unit) * 1e6) / 1e6;
}

/** The profile row (locked for update inside a transaction), or 404. */
export async function loadProfile(profileId: number, transaction?: Transaction) {
  const profile = await ProfileModel.findByPk(profileId, { transaction, lock: transaction ? transaction.LOCK.UPDATE : undefined });
  if (!profile) throw AppError.notFound('profile');
  return profile;
}


export type ProfileUnits = { displayName: string; carbBasis: CarbBasis; carbUnit: CarbUnit };

/** A profile's name and carbohydrate basis and unit, read once per request (the sign-in check often has them), or 404. */
export async function profileUnits(profileId: number): Promise<ProfileUnits> {
  const units = await remember(`profile-units:${profileId}`, async () => {
    const row = await ProfileModel.findByPk(profileId, { attributes: ['displayName', 'carbBasis', 'carbUnit'], raw: true });
    return row ? { displayName: row.displayName, carbBasis: row.carbBasis, carbUnit: row.carbUnit } : null;
  });
  if (!units) throw AppError.notFound('profile');
  return units;
}
