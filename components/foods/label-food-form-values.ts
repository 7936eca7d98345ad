import type { FieldErrors, Resolver } from 'react-hook-form';
import { createLabelFoodInputSchema, type CreateLabelFoodValues } from '../../shared/schemas/food';

/** What the form holds: text exactly as typed; turned into numbers only for validation and sending. */
export type LabelFoodFormValues = {
  name: string;
  brand: string;
  basis: 'per100g' | 'perServing';
  servingGrams: string;
  convention: 'eu' | 'us';
  carbohydrate: string;
  fibre: string;
  sugars: string;
  protein: string;
  fat: string;
  energyKcal: string;
};

export const LABEL_FOOD_FIELDS = ['name', 'brand', 'basis', 'servingGrams', 'convention', 'carbohydrate', 'fibre', 'sugars', 'protein', 'fat', 'energyKcal'] as const;

export const emptyLabelFood: LabelFoodFormValues = {
  name: '',
  brand: '',
  basis: 'per100g',
  servingGrams: '',
  convention: 'eu',
  carbohydrate: '',
  fibre: '',
  sugars: '',
  protein: '',
  fat: '',
  energyKcal: '',
};

// "12,5" (decimal comma, as many labels print it) reads as 12.5; blank is "not printed"; anything else stays text so the schema names it.
const num = (s: string): number | null | string => {
  const t = s.trim().replace(',', '.');
  if (t === '') return null;
  return /^-?\d*\.?\d+$/.test(t) ? Number(t) : s;
};

/** The API input from the typed values (unparsable numbers are passed on for the shared schema to reject). */
export function toLabelFoodInput(v: LabelFoodFormValues): Record<string, unknown> {
  return {
    name: v.name,
    brand: v.brand.trim() || null,
    basis: v.basis,
    servingGrams: v.basis === 'perServing' ? num(v.servingGrams) : null,
    convention: v.convention,
    carbohydrate: num(v.carbohydrate) ?? '',
    fibre: num(v.fibre),
    sugars: num(v.sugars),
    protein: num(v.protein),
    fat: num(v.fat),
    energyKcal: num(v.energyKcal),
  };
}

/** Validates the typed values with the same zod schema the server uses. */
export const labelFoodResolver: Resolver<LabelFoodFormValues> = async (values) => {
  const parsed = createLabelFoodInputSchema.safeParse(toLabelFoodInput(values));
  if (parsed.success) return { values, errors: {} };
  const errors: FieldErrors<LabelFoodFormValues> = {};
  for (const issue of parsed.error.issues) {
    const key = String(issue.path[0] ?? 'name') as keyof LabelFoodFormValues;
    if (!errors[key]) errors[key] = { type: 'validation', message: issue.message };
  }
  return { values: {}, errors };
};

/** Parsed values, for submit (call only after the resolver passed). */
export function parseLabelFood(v: LabelFoodFormValues): CreateLabelFoodValues {
  return createLabelFoodInputSchema.parse(toLabelFoodInput(v));
}
