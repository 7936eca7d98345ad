import { QueryTypes } from 'sequelize';
import { carbUnderstated } from '../../shared/compute/batch';
import { carbInBasis, type Nutrients } from '../../shared/compute/nutrients';
import { normalizePortionCode } from '../../shared/compute/portion-code';
import { gramsToCarbUnit } from '../../shared/compute/units';
import type { Portion, PortionDetail, PortionStatus } from '../../shared/schemas/portion';
import type { ProfileAccessRole } from '../../shared/schemas/auth';
import type { CarbBasis, CarbUnit } from '../../shared/schemas/units';
import { AppError } from '../errors';
import { BatchModel, PortionModel } from '../models';
import { findProfileAccess } from './auth.service';
import { profileActionAllowed, type GrantPermission, type ProfileAction } from '../../shared/schemas/profile-actions';

type Units = { basis: CarbBasis; unit: CarbUnit };

/** Carbohydrate grams (null = unknown) with the same amount in the counting unit, full precision. */
export function carbOf(grams: number | null, unit: CarbUnit) {
  return { grams, inUnit: grams == null ? null : gramsToCarbUnit(grams, unit) };
}

/** API shape of a portion, carbohydrate in the profile's basis and unit (unknown when the batch's sum understates it). */
type PortionRow = Pick<PortionModel, 'id' | 'code' | 'batchId' | 'profileId' | 'position' | 'containerName' | 'grossGrams' | 'tareGrams' | 'netGrams' | 'carbAvailable' | 'carbTotal' | 'status' | 'statusChangedAt'>;

export function toPortion(p: PortionRow, units: Units, understated = false): Portion {
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
export async function findPortionForUser(rawCode: string, userId: number, action: ProfileAction = 'kitchen.read') {
  const code = normalizePortionCode(rawCode);
  if (!code) throw AppError.notFound('portion');
  const portion = await PortionModel.findOne({ where: { code }, include: [{ model: BatchModel, as: 'batch' }] });
  if (!portion) throw AppError.notFound('portion');
  const access = await findProfileAccess(userId, portion.profileId);
  if (!access) throw AppError.notFound('portion');
  if (!profileActionAllowed(access, action)) throw AppError.forbidden('Your access to this profile does not allow that.');
  return portion;
}

type PortionPageRow = PortionRow & {
  recipeTitle: string;
  recipeId: number | null;
  cookedOn: string;
  useBy: string;
  storage: PortionDetail['storage'];
  totals: Nutrients;
  per100g: Nutrients;
  incomplete: string[];
  profileName: string;
  carbBasis: CarbBasis;
  carbUnit: CarbUnit;
  accessRole: ProfileAccessRole | null;
  accessPermissions: GrantPermission[] | null;
};

/**
 * What a label's QR code opens: one portion with its batch's dates and per-100 g carbohydrate. One statement reads
 * the portion, its batch, its profile's units and the reader's access (the page is opened from every label scan).
 * Strangers get the same 404 as a code that does not exist.
 */
export async function getPortion(rawCode: string, userId: number): Promise<PortionDetail> {
  const code = normalizePortionCode(rawCode);
  if (!code) throw AppError.notFound('portion');
  const [row] = await PortionModel.sequelize!.query<PortionPageRow>(
    `SELECT p.id, p.code, p.batch_id AS "batchId", p.profile_id AS "profileId", p.position, p.container_name AS "containerName",
            p.gross_grams AS "grossGrams", p.tare_grams AS "tareGrams", p.net_grams AS "netGrams",
            p.carb_available AS "carbAvailable", p.carb_total AS "carbTotal", p.status, p.status_changed_at AS "statusChangedAt",
            b.recipe_title AS "recipeTitle", b.recipe_id AS "recipeId", b.cooked_on AS "cookedOn", b.use_by AS "useBy",
            b.storage, b.totals, b.per100g, b.incomplete,
            pr.display_name AS "profileName", pr.carb_basis AS "carbBasis", pr.carb_unit AS "carbUnit",
            pa.role AS "accessRole", pa.permissions AS "accessPermissions"
       FROM portions p
       JOIN batches b ON b.id = p.batch_id
       JOIN profiles pr ON pr.id = p.profile_id
       LEFT JOIN profile_access pa ON pa.profile_id = p.profile_id AND pa.user_id = :userId
      WHERE p.code = :code`,
    { replacements: { code, userId }, type: QueryTypes.SELECT },
  );
  if (!row || !row.accessRole || !profileActionAllowed({ role: row.accessRole, permissions: row.accessPermissions }, 'kitchen.read')) {
    throw AppError.notFound('portion');
  }
  const units = { basis: row.carbBasis, unit: row.carbUnit };
  const understated = carbUnderstated(row.totals, row.incomplete, units.basis);
  return {
    ...toPortion(row, units, understated),
    recipeTitle: row.recipeTitle,
    recipeId: row.recipeId,
    cookedOn: row.cookedOn,
    useBy: row.useBy,
    storage: row.storage,
    carbPer100g: carbOf(understated ? null : carbInBasis(row.per100g, units.basis), units.unit),
    basis: units.basis,
    unit: units.unit,
    profileName: row.profileName,
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
