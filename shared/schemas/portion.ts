import { z } from 'zod';

/** Where a batch is kept: sets the default use-by date. */
export const storageSchema = z.enum(['fridge', 'freezer']);
export type StorageKind = z.infer<typeof storageSchema>;

export const portionStatusSchema = z.enum(['available', 'eaten', 'discarded']);
export type PortionStatus = z.infer<typeof portionStatusSchema>;

/** Carbohydrate of an amount: grams in the profile's basis (null = unknown) and the same in its counting unit. */
export const carbAmountSchema = z.object({ grams: z.number().nullable(), inUnit: z.number().nullable() });

/** One portion as the API returns it; carbohydrate in the profile's basis and unit at full precision. */
export const portionSchema = z.object({
  id: z.number().int(),
  code: z.string(),
  batchId: z.number().int(),
  profileId: z.number().int(),
  position: z.number().int(),
  containerName: z.string().nullable(),
  grossGrams: z.number().nullable(),
  tareGrams: z.number().nullable(),
  netGrams: z.number(),
  carb: carbAmountSchema,
  status: portionStatusSchema,
  statusChangedAt: z.string().nullable(),
});
export type Portion = z.infer<typeof portionSchema>;

/** What a label's QR code opens: the portion with its batch's numbers and dates. */
export const portionDetailSchema = portionSchema.extend({
  recipeTitle: z.string(),
  recipeId: z.number().int().nullable(),
  cookedOn: z.string(),
  useBy: z.string(),
  storage: storageSchema,
  carbPer100g: carbAmountSchema,
  basis: z.enum(['available', 'total']),
  unit: z.enum(['g', 'portion10', 'unit12', 'exchange15']),
  profileName: z.string(),
});
export type PortionDetail = z.infer<typeof portionDetailSchema>;

/** The code path segment: any case, dashes and spaces allowed. */
export const portionCodeParamSchema = z.object({ code: z.string().trim().min(1).max(20) });

export const portionListQuerySchema = z.object({ status: portionStatusSchema.optional() });

/** One printed label: everything a person needs at the fridge, already rounded by the display rule. */
export type PortionLabel = {
  code: string;
  displayCode: string;
  url: string;
  /** PNG data URL of a QR code that encodes `url`. */
  qrDataUrl: string;
  recipeTitle: string;
  cookedOn: string;
  useBy: string;
  storage: 'fridge' | 'freezer';
  netGrams: number;
  carb: { grams: number | null; inUnit: number | null };
  carbPer100g: { grams: number | null; inUnit: number | null };
  /** carbLine: the label's carbohydrate with its unit and basis, e.g. "2.9 CP · 29 g carbohydrate (available)". */
  text: { net: string; carb: string; carbGrams: string; carbLine: string; carbPer100g: string };
  status: PortionStatus;
};

/** The printable sheet of a batch: one label per portion. */
export type LabelSheet = {
  batchId: number;
  recipeTitle: string;
  basis: 'available' | 'total';
  unit: 'g' | 'portion10' | 'unit12' | 'exchange15';
  useBySource: string;
  /** Whose batch it is, when the household has more than one profile; null otherwise. */
  personName: string | null;
  labels: PortionLabel[];
};
