/** Where a batch is kept; sets the default use-by date. */
export type Storage = 'fridge' | 'freezer';

/** Which food-safety authority's advice the default follows. */
export type FoodSafetyRegion = 'uk' | 'us';

export type UseByRule = { days?: number; months?: number; source: string; note: string };

/**
 * Default storage times for home-cooked leftovers. US: USDA FSIS "Leftovers and Food Safety" (fridge 3–4 days,
 * we take 3; freezer 3–4 months for best quality, we take 3). UK: Food Standards Agency advice as paraphrased by
 * UK food-hygiene training (eat or freeze within 2 days, cooked rice within 1 day); the UK freezer time is not
 * stated there, so the USDA quality guide is used.
 */
export const USE_BY_RULES: Record<FoodSafetyRegion, Record<Storage, UseByRule> & { rice: UseByRule }> = {
  us: {
    fridge: { days: 3, source: 'USDA FSIS, Leftovers and Food Safety', note: 'Refrigerate within 2 hours of cooking; use within 3–4 days.' },
    freezer: { months: 3, source: 'USDA FSIS, Leftovers and Food Safety', note: 'Best quality within 3–4 months; safe while kept frozen at −18 °C.' },
    rice: { days: 3, source: 'USDA FSIS, Leftovers and Food Safety', note: 'Refrigerate within 2 hours of cooking; use within 3–4 days.' },
  },
  uk: {
    fridge: { days: 2, source: 'UK Food Standards Agency (leftovers advice)', note: 'Cool and refrigerate within 2 hours; eat or freeze within 2 days.' },
    freezer: { months: 3, source: 'USDA FSIS quality guide (the FSA gives no fixed time)', note: 'Defrost in the fridge and eat within 24 hours of defrosting.' },
    rice: { days: 1, source: 'UK Food Standards Agency (cooked rice)', note: 'Cool cooked rice within 1 hour; eat within 1 day.' },
  },
};

/** Picks the region from a locale tag: en-US and es-US → us, everything else → uk (the stricter default). */
export function regionForLocale(locale: string | undefined): FoodSafetyRegion {
  return /[-_]US\b/i.test(locale ?? '') ? 'us' : 'uk';
}

function addDays(isoDate: string, days: number, months: number): string {
  const [y, m, d] = isoDate.split('-').map(Number);
  const date = new Date(Date.UTC(y, m - 1 + months, 1));
  const lastDay = new Date(Date.UTC(date.getUTCFullYear(), date.getUTCMonth() + 1, 0)).getUTCDate();
  date.setUTCDate(Math.min(d, lastDay) + days);
  return date.toISOString().slice(0, 10);
}

/**
 * Default use-by date (YYYY-MM-DD) for a batch cooked on `cookedOn` (YYYY-MM-DD), with the rule's source.
 * Rice in the fridge follows the stricter rice rule. Month steps clamp to the month's last day.
 */
export function defaultUseBy(cookedOn: string, storage: Storage, region: FoodSafetyRegion, containsRice = false) {
  const rule = storage === 'fridge' && containsRice ? USE_BY_RULES[region].rice : USE_BY_RULES[region][storage];
  return { useBy: addDays(cookedOn, rule.days ?? 0, rule.months ?? 0), source: rule.source, note: rule.note };
}

/** True when a food's name says it is rice (word match, so "licorice" is not rice). */
export function isRiceFood(foodName: string): boolean {
  return /\brice\b/i.test(foodName);
}

/** True when any ingredient that went into the batch (not left out) is rice: the stricter fridge rule applies. */
export function batchContainsRice(lines: readonly { foodName: string; omitted?: boolean }[]): boolean {
  return lines.some((l) => !l.omitted && isRiceFood(l.foodName));
}

/** Whole days from `today` to `useBy` (both YYYY-MM-DD): 0 = last day, negative = expired. */
export function daysUntil(useBy: string, today: string): number {
  return Math.round((Date.parse(`${useBy}T00:00:00Z`) - Date.parse(`${today}T00:00:00Z`)) / 86_400_000);
}
