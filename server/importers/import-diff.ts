import { NUTRIENT_KEYS, type NutrientKey, type Nutrients } from '../../shared/compute/nutrients';
import type { FoodInput } from './dataset';

/** How many foods of each kind an entry lists at most (the counts are always complete). */
export const DIFF_EXAMPLES = 50;

export type DiffFood = { code: string; name: string };
export type ChangedFood = DiffFood & { fields: { key: NutrientKey; from: number | null; to: number | null }[] };
export type EmptiedFood = DiffFood & { reason: 'loses most values' | 'no values in the files'; lost: NutrientKey[] };
export type ImportDiff = {
  added: { count: number; examples: DiffFood[] };
  changed: { count: number; examples: ChangedFood[] };
  emptied: { count: number; examples: EmptiedFood[] };
  unchanged: number;
};

/** A food of the same source as it is stored now. */
export type StoredFood = { code: string; name: string; hash: string | null; nutrients: Nutrients };

const known = (n: Nutrients) => NUTRIENT_KEYS.filter((k) => n[k] != null);

/**
 * What a re-import would do to the stored foods of one source: new codes (added), codes whose rows differ
 * (changed, with the nutrient values that move) and foods that would end up blank — an existing food losing more
 * than half of its known values, or any food the files give no nutrient value at all (a file cut short at a line end).
 */
export function diffImport(stored: Map<string, StoredFood>, incoming: { input: FoodInput; hash: string }[]): ImportDiff {
  const diff: ImportDiff = { added: { count: 0, examples: [] }, changed: { count: 0, examples: [] }, emptied: { count: 0, examples: [] }, unchanged: 0 };
  const push = <T>(entry: { count: number; examples: T[] }, item: T) => {
    entry.count += 1;
    if (entry.examples.length < DIFF_EXAMPLES) entry.examples.push(item);
  };
  for (const { input, hash } of incoming) {
    const old = stored.get(input.sourceCode);
    const food = { code: input.sourceCode, name: input.name };
    const now = known(input.nutrients);
    if (old && old.hash === hash) {
      diff.unchanged += 1;
      continue;
    }
    if (!old) push(diff.added, food);
    else {
      const fields = NUTRIENT_KEYS.filter((k) => old.nutrients[k] !== input.nutrients[k]).map((key) => ({ key, from: old.nutrients[key], to: input.nutrients[key] }));
      push(diff.changed, { ...food, fields });
    }
    const before = old ? known(old.nutrients) : [];
    const lost = before.filter((k) => input.nutrients[k] == null);
    if (now.length === 0) push(diff.emptied, { ...food, reason: 'no values in the files', lost });
    else if (before.length > 0 && lost.length * 2 > before.length) push(diff.emptied, { ...food, reason: 'loses most values', lost });
  }
  return diff;
}
