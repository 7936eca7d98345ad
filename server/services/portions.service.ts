import { QueryTypes } from 'sequelize';
import { carbUnderstated } from '../../shared/compute/batch';
import { carbInBasis } from '../../shared/compute/nutrients';
import { normalizePortionCode } from '../../shared/compute/portion-code';
import { gramsToCarbUnit } from '../../shared/compute/units';
import type { Portion, PortionDetail, PortionStatus } from '../../shared/schemas/portion';
import type { CarbBasis, CarbUnit } from '../../shared/schemas/units';
import { AppError } from '../errors';
import { BatchModel, PortionModel, ProfileModel } from '../models';
import { findProfileAccess } from './auth.service';
import { profileActionAllowed, type ProfileAction } from '../../shared/schemas/profile-actions';

type Units = { basis: CarbBasis; unit: CarbUnit };

/** Carbohydrate grams (null = unknown) with the same amount in the counting unit, full precision. */
export function carbOf(grams: number | null, unit: CarbUnit) {
  return { grams, inUnit: grams == null ? null : gramsToCarbUnit(grams, unit) };
}

/** API shape of a portion, carbohydrate in the profile's basis and unit (unknown when the batch's sum understates it). */
export function toPortion(p: PortionModel, units: Units, understated = false): Portion {
  return {
    id: p.id,
    code: p.code,
    batchId: p.batchId,
    profileId: p.profileId,
    position: p.position,
    containerName: p.containerName,
    grossGrams: p.grossGrams,
    tareGrams: p.tareGrams,
    netGrams: p.netGrams,
    carb: carbOf(understated ? null : units.basis === 'available' ? p.carbAvailable : p.carbTotal, units.unit),
    status: p.status,
    statusChangedAt: p.statusChangedAt ? p.statusChangedAt.toISOString() : null,
  };
}

/**
 * Finds a portion by its typed or scanned code for someone with access to its profile. Strangers get the
 * same 404 as a code that does not exist; `action` names what they want to do with it.
 */
async function findPortionForUser(rawCode: string, userId: number, action: ProfileAction = 'kitchen.read') {
  const code = normalizePortionCode(rawCode);
  if (!code) throw AppError.notFound('portion');
  const portion = await PortionModel.findOne({ where: { code }, include: [{ model: BatchModel, as: 'batch' }] });
  if (!portion) throw AppError.notFound('portion');
  const access = await findProfileAccess(userId, portion.profileId);
  if (!access) throw AppError.notFound('portion');
  if (!profileActionAllowed(access, action)) throw AppError.forbidden('Your access to this profile does not allow that.');
  return portion;
}

/** What a label's QR code opens: one portion with its batch's dates and per-100 g carbohydrate. */
export async function getPortion(rawCode: string, userId: number): Promise<PortionDetail> {
  const portion = await findPortionForUser(rawCode, userId);
  const profile = (await ProfileModel.findByPk(portion.profileId))!;
  const units = { basis: profile.carbBasis, unit: profile.carbUnit };
  const batch = portion.batch!;
  const understated = carbUnderstated(batch.totals, batch.incomplete, units.basis);
  return {
    ...toPortion(portion, units, understated),
    recipeTitle: batch.recipeTitle,
    recipeId: batch.recipeId,
    cookedOn: batch.cookedOn,
    useBy: batch.useBy,
    storage: batch.storage,
    carbPer100g: carbOf(understated ? null : carbInBasis(batch.per100g, units.basis), units.unit),
    basis: units.basis,
    unit: units.unit,
    profileName: profile.displayName,
  };
}

const STATUS_WORDS: Record<PortionStatus, string> = { available: 'not eaten yet', eaten: 'eaten', discarded: 'thrown away' };

/**
 * Marks a portion eaten or thrown away (only from not eaten yet), or undoes that (back to available, only from eaten or
 * thrown away). One conditional UPDATE, so two people (or two taps) cannot both succeed: the second gets 409.
 * Clinicians may look but not mark.
 */
export async function setPortionStatus(rawCode: string, userId: number, status: PortionStatus): Promise<PortionDetail> {
  const portion = await findPortionForUser(rawCode, userId, 'kitchen.write');
  const [, affected] = await PortionModel.sequelize!.query(
    `UPDATE portions SET status = :status, status_changed_at = now(), status_changed_by_user_id = :userId, updated_at = now()
     WHERE id = :id AND ${status === 'available' ? "status IN ('eaten', 'discarded')" : "status = 'available'"}`,
    { replacements: { status, userId, id: portion.id }, type: QueryTypes.UPDATE },
  );
  if (affected !== 1) {
    await portion.reload();
    throw AppError.conflict(`This portion is already ${STATUS_WORDS[portion.status as PortionStatus]}.`);
  }
  return getPortion(portion.code, userId);
}
