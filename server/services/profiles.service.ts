import type { Transaction } from 'sequelize';
import { glucoseFromMmol } from '../../shared/compute/units';
import type { GlucoseUnit } from '../../shared/schemas/units';
import { AppError } from '../errors';
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

