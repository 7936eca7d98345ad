import QRCode from 'qrcode';
import { formatPortionCode } from '../../shared/compute/portion-code';
import { formatCarb } from '../../shared/compute/units';
import type { LabelSheet } from '../../shared/schemas/portion';
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

/**
 * Builds the label sheet of a batch: one label per portion (eaten and discarded ones too, marked), numbers
 * rounded by the shared display rule (formatCarb), each with a QR code for its portion page.
 */
export async function buildLabelSheet(profileId: number, batchId: number, origin: string): Promise<LabelSheet> {
  const batch = await getBatch(profileId, batchId);
  const labels = await Promise.all(
    batch.portions.map(async (p) => {
      const url = portionUrl(origin, p.code);
      const qrDataUrl = await qrPng(url);
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
          carb: formatCarb(p.carb.grams, batch.unit),
          carbGrams: formatCarb(p.carb.grams, 'g'),
          carbPer100g: formatCarb(batch.carbPer100g.grams, 'g'),
        },
        status: p.status,
      };
    }),
  );
  return { batchId: batch.id, recipeTitle: batch.recipeTitle, basis: batch.basis, unit: batch.unit, useBySource: batch.useBySource, labels };
}
