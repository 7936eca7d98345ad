import { createPackFoodInputSchema, type Food } from '../../shared/schemas/food';
import { requestFormSchema } from '../ui/request-form-schema';

/** What the form holds: text exactly as typed; turned into numbers only for validation and sending. */
export type PackFoodFormValues = {
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
  /** "private", or the id of the profile the food is shared with. */
  share: string;
};

export const PACK_FOOD_FIELDS = ['name', 'brand', 'basis', 'servingGrams', 'convention', 'carbohydrate', 'fibre', 'sugars', 'protein', 'fat', 'energyKcal'] as const;

/** Where a request field's error lands in the form. */
export const packFoodFieldOf = (path: string) =>
  path === 'sharedProfileId' ? ('share' as const) : (PACK_FOOD_FIELDS as readonly string[]).includes(path) ? (path as (typeof PACK_FOOD_FIELDS)[number]) : undefined;

export const emptyPackFood: PackFoodFormValues = {
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
  share: 'private',
};

const typed = (v: number | null) => (v == null ? '' : String(v));

/** The edit form's starting values from a saved pack food: its values per 100 g as stored (a per-serving label was converted on save). */
export function packFoodValuesOf(food: Food): PackFoodFormValues {
  const brand = food.brand ?? '';
  const suffix = brand ? ` (${brand})` : '';
  const us = food.labelConvention === 'us';
  const own = (k: 'energyKcal') => (food.derived.includes(k) ? null : food.per100g[k]);
  return {
    name: suffix && food.name.endsWith(suffix) ? food.name.slice(0, -suffix.length) : food.name,
    brand,
    basis: 'per100g',
    servingGrams: '',
    convention: us ? 'us' : 'eu',
    carbohydrate: typed(us ? food.per100g.carbTotal : food.per100g.carbAvailable),
    fibre: typed(food.per100g.fibre),
    sugars: typed(food.per100g.sugars),
    protein: typed(food.per100g.protein),
    fat: typed(food.per100g.fat),
    energyKcal: typed(own('energyKcal')),
    share: food.sharedProfileId == null ? 'private' : String(food.sharedProfileId),
  };
}

// "12,5" (decimal comma, as many labels print it) reads as 12.5; blank is "not printed"; anything else stays text so the schema names it.
const num = (s: string): number | null | string => {
  const t = s.trim().replace(',', '.');
  if (t === '') return null;
  return /^-?\d*\.?\d+$/.test(t) ? Number(t) : s;
};

/** The request body from the typed values (unparsable numbers are passed on for the shared schema to reject). */
export function toPackFoodRequest(v: PackFoodFormValues): Record<string, unknown> {
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
    sharedProfileId: v.share === 'private' ? null : Number(v.share),
  };
}

/** The form's schema: the shared create schema, read from the typed values (for zodResolver). */
export const packFoodFormSchema = requestFormSchema(createPackFoodInputSchema, (v: PackFoodFormValues) => ({ request: toPackFoodRequest(v), fieldOf: packFoodFieldOf }));
