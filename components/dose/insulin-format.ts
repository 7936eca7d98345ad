/**
 * Insulin for display: "units" written in full (never "u"/"U"), no trailing zeros ("1.5 units", "3 units", "1 unit"),
 * at most `decimals` places. Medication-safety notation: ISMP list of error-prone abbreviations; Joint Commission
 * "Do Not Use" list (trailing zeros, "U").
 */
export function formatInsulinUnits(units: number, decimals = 2): string {
  const factor = 10 ** decimals;
  const rounded = Math.round(Math.abs(units) * factor) / factor;
  const text = String(Number(rounded.toFixed(decimals)));
  return `${units < 0 && rounded > 0 ? '−' : ''}${text} ${rounded === 1 ? 'unit' : 'units'}`;
}

/** A dose already rounded to the pen step (0.5 or 1): at most one decimal. */
export const formatDoseUnits = (units: number) => formatInsulinUnits(units, 1);
