import { createBatchInputSchema, type CreateBatchInput } from '../../shared/schemas/batch';
import { requestFormSchema } from '../ui/request-form-schema';
import { num, type CookFormValues, type Weighing } from './cook-state';

export type CookStep = 'weigh' | 'cooked' | 'split' | 'store';

const weighing = (w: Weighing) => ({ containerId: w.containerId ? Number(w.containerId) : null, grossGrams: num(w.gross) ?? Number.NaN, tareGrams: num(w.tare) ?? 0 });

/** The request body the server validates (it re-checks everything and computes the numbers it stores). */
export function toCreateBatchRequest(v: CookFormValues): CreateBatchInput {
  return {
    recipeId: v.recipeId,
    scaleFactor: num(v.factor) ?? Number.NaN,
    cookedOn: v.cookedOn,
    storage: v.storage,
    region: v.region,
    useBy: v.useBy.trim() || null,
    ingredients: v.lines.map((l) => ({
      foodId: l.foodId,
      plannedGrams: l.plannedGrams,
      actualGrams: l.omitted ? null : num(l.reading),
      omitted: l.omitted,
      swappedFromFoodId: l.swappedFrom?.foodId ?? null,
    })),
    cookedWeight: weighing(v.pot),
    split: v.splitMode === 'equal' ? { mode: 'equal', count: num(v.count) ?? Number.NaN } : { mode: 'weighed', portions: v.portions.map(weighing) },
  };
}

const WEIGHING_FIELD: Record<string, keyof Weighing> = { grossGrams: 'gross', tareGrams: 'tare', containerId: 'gross' };

/** Where an error on a request path ("ingredients.2.actualGrams", "split.portions.0.tareGrams") lands in the form. */
export function cookFieldOf(path: string): string | undefined {
  let m = /^ingredients\.(\d+)\.\w+$/.exec(path);
  if (m) return `lines.${m[1]}.reading`;
  if (path === 'ingredients') return 'lines';
  m = /^cookedWeight\.(\w+)$/.exec(path);
  if (m) return `pot.${WEIGHING_FIELD[m[1]] ?? 'gross'}`;
  m = /^split\.portions\.(\d+)\.(\w+)$/.exec(path);
  if (m) return `portions.${m[1]}.${WEIGHING_FIELD[m[2]] ?? 'gross'}`;
  if (path.startsWith('split.portions')) return 'portions';
  if (path.startsWith('split')) return 'count';
  if (path === 'scaleFactor') return 'factor';
  return ['cookedOn', 'useBy', 'storage', 'region'].includes(path) ? path : undefined;
}

/** Which step shows a form field. */
export function stepOfField(field: string): CookStep {
  if (field.startsWith('lines') || field === 'factor') return 'weigh';
  if (field.startsWith('pot')) return 'cooked';
  if (field.startsWith('portions') || field === 'count' || field === 'splitMode') return 'split';
  return 'store';
}

/** The cook form's schema for zodResolver: the shared create-batch schema on the built request. */
export const cookFormSchema = requestFormSchema(createBatchInputSchema, (v: CookFormValues) => ({ request: toCreateBatchRequest(v), fieldOf: cookFieldOf }));
