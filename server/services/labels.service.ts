import QRCode from 'qrcode';
import { QueryTypes } from 'sequelize';
import { formatPortionCode } from '../../shared/compute/portion-code';
import { formatCarb } from '../../shared/compute/units';
import type { LabelSheet } from '../../shared/schemas/portion';
import { ProfileModel } from '../models';
import { getBatch } from './batches.service';

/** The absolute URL a label's QR code opens: the portion page of the web app. */
export function portionUrl(origin: string, code: string): string {
  return `${origin.replace(/\/+$/, '')}/portions/${code}`;
}

// A URL's QR code never changes, and drawing one costs a few ms of CPU: keep the most recent ones.
const QR_CACHE_SIZE = 2000;
const qrCache = new Map<string, string>();

/** PNG data URL of a QR code for `url` (error correction M, 4 px per module), cached. */
export async function qrPng(url: string): Promise<string> {
  const hit = qrCache.get(url);
  if (hit) return hit;
  const png = await QRCode.toDataURL(url, { errorCorrectionLevel: 'M', margin: 2, scale: 4 });
  if (qrCache.size >= QR_CACHE_SIZE) qrCache.delete(qrCache.keys().next().value!);
  qrCache.set(url, png);
  return png;
}

/** The profile's name when its owner keeps more than one profile (a label must say whose batch it is), else null. */
export async function householdName(profileId: number): Promise<string | null> {
  const [row] = await ProfileModel.sequelize!.query<{ display_name: string; kept: number }>(
    `SELECT p.display_name, (SELECT count(*) FROM profiles o WHERE o.owner_user_id = p.owner_user_id)::int AS kept
       FROM profiles p WHERE p.id = :profileId AND p.owner_user_id IS NOT NULL`,
    { replacements: { profileId }, type: QueryTypes.SELECT },
  );
  return row && row.kept > 1 ? row.display_name : null;
}

/**
 * Builds the label sheet of a batch: one label per portion (eaten and discarded ones too, marked), numbers
 * rounded by the shared display rule (formatCarb) with the basis named, the person's name when the household has
 * more than one profile, each with a QR code for its portion page.
 */
export async function buildLabelSheet(profileId: number, batchId: number, origin: string): Promise<LabelSheet> {
  const [batch, personName] = await Promise.all([getBatch(profileId, batchId), householdName(profileId)]);
  const labels = await Promise.all(
    batch.portions.map(async (p) => {
      const url = portionUrl(origin, p.code);
      const qrDataUrl = await qrPng(url);
      const carb = formatCarb(p.carb.grams, batch.unit);
      const carbGrams = formatCarb(p.carb.grams, 'g');
      return {
        code: p.code,
        displayCode: formatPortionCode(p.code),
        url,
        qrDataUrl,
        recipeTitle: batch.recipeTitle,
        cookedOn: batch.cookedOn,
        useBy: batch.useBy,
        storage: batch.storage,
        netGrams: p.netGrams,
        carb: p.carb,
        carbPer100g: batch.carbPer100g,
        text: {
          net: `${Math.round(p.netGrams)} g`,
          carb,
          carbGrams,
          carbLine: `${carb}${carb === carbGrams ? '' : ` · ${carbGrams}`} carbohydrate (${batch.basis})`,
          carbPer100g: formatCarb(batch.carbPer100g.grams, 'g'),
        },
        status: p.status,
      };
    }),
  );
  return { batchId: batch.id, recipeTitle: batch.recipeTitle, basis: batch.basis, unit: batch.unit, useBySource: batch.useBySource, personName, labels };
}
