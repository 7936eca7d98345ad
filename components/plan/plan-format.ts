import type { PlanMealView } from '../../shared/schemas/plan';
import { formatCarb } from '../../shared/compute/units';
import type { Totals } from '../../shared/compute/plan';
import type { CarbUnit } from '../../shared/schemas/units';
import { formatDoseUnits } from '../dose/insulin-format';

/** The one line every planned dose carries (README glossary: planned dose). */
export const PLANNED_DOSE_WORDS = 'Planned dose — meal part only; glucose unknown until you eat.';

/** A planned meal's dose as text: "3.5 units (1 unit per 10 g)" or why there is none. */
export function plannedDoseText(dose: PlanMealView['dose']): string {
  switch (dose.status) {
    case 'ok':
      return `${formatDoseUnits(dose.units)} (1 unit per ${dose.carbRatio} g${dose.capped ? ', capped at your largest single dose' : ''})`;
    case 'no_ratio':
      return 'No ratio for this time';
    case 'no_settings':
      return 'No dose: settings not set up';
    case 'unknown_carb':
      return 'No dose: carbohydrate unknown';
  }
}

/** Carbohydrate of a meal, with the planned value beside a weighed one when they differ. */
export function mealCarbText(meal: PlanMealView, unit: CarbUnit): string {
  const now = formatCarb(meal.carb.grams, unit);
  if (!meal.plannedCarb || meal.plannedCarb.grams == null || meal.carb.grams == null) return now;
  const planned = formatCarb(meal.plannedCarb.grams, unit);
  return planned === now ? now : `${now} cooked (planned ${planned})`;
}

/** A day's or week's totals in words. */
export function totalsText(t: Totals, unit: CarbUnit): { carb: string; rapid: string; long: string } {
  return {
    carb: `${formatCarb(t.carbGrams, unit)}${t.carbIncomplete ? ' (some unknown)' : ''}`,
    rapid: `${formatDoseUnits(t.rapidUnits)}${t.rapidIncomplete ? ' (some meals without a dose)' : ''}`,
    long: t.longActingUnits == null ? 'not set' : formatDoseUnits(t.longActingUnits),
  };
}
