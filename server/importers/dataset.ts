import type { Nutrients } from '../../shared/compute/nutrients';
import type { FoodExtra } from '../models/food.model';
import type { DatasetName } from '../models/dataset-import.model';

/** One food as an importer hands it to the writer. */
export type FoodInput = {
  sourceCode: string;
  name: string;
  foodGroup: string | null;
  altNames: string[];
  nutrients: Nutrients;
  carbMeasured: 'available' | 'total' | null;
  derived: string[];
  carbNote: string | null;
  extra: FoodExtra;
  measures: { label: string; grams: number }[];
};

/** Everything read from a dataset's files, before anything is written. */
export type ParsedDataset = {
  dataset: DatasetName;
  version: string;
  attribution: string;
  licence: string;
  foods: FoodInput[];
  rowsRead: number;
  skipped: SkipLog;
};

/** Counts skipped rows by reason, keeping a few examples (file and line) of each. */
export class SkipLog {
  readonly reasons = new Map<string, { count: number; examples: string[] }>();

  add(reason: string, where: string) {
    const entry = this.reasons.get(reason) ?? { count: 0, examples: [] };
    entry.count += 1;
    if (entry.examples.length < 5) entry.examples.push(where);
    this.reasons.set(reason, entry);
  }

  get total(): number {
    let n = 0;
    for (const r of this.reasons.values()) n += r.count;
    return n;
  }

  toJSON() {
    return [...this.reasons.entries()].map(([reason, r]) => ({ reason, count: r.count, examples: r.examples }));
  }
}

export type ProgressFn = (stage: string, rowsRead: number) => void;

export const USDA_LICENCE = 'Public domain (USDA: "not copyrighted"; FoodData Central: CC0 1.0)';
