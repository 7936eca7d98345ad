import { createHash } from 'node:crypto';
import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import { FoodMeasureModel, FoodModel } from '../models';
import type { FoodSource } from '../models/food.model';
import type { FoodInput } from './dataset';
import { searchKeys } from './food-rows';

const CHUNK = 1000;

export type WriteCounts = { inserted: number; updated: number; unchanged: number };

function hashOf(input: FoodInput, attribution: string, licence: string): string {
  return createHash('sha1').update(JSON.stringify([input, attribution, licence])).digest('hex');
}

/**
 * Upserts foods of one source inside the caller's transaction: new codes are inserted, changed ones updated
 * (their measures replaced), identical ones left alone, so a re-import changes nothing.
 */
export async function writeFoods(
  sequelize: Sequelize,
  t: Transaction,
  opts: { source: FoodSource; attribution: string; licence: string; importId: number; foods: FoodInput[] },
  onProgress?: (written: number) => void,
): Promise<WriteCounts> {
  const existing = await sequelize.query<{ id: number; source_code: string; content_hash: string | null }>(
    'SELECT id, source_code, content_hash FROM foods WHERE source = :source',
    { replacements: { source: opts.source }, type: QueryTypes.SELECT, transaction: t },
  );
  const byCode = new Map(existing.map((r) => [r.source_code, r]));
  const counts: WriteCounts = { inserted: 0, updated: 0, unchanged: 0 };
  const pending: { input: FoodInput; hash: string }[] = [];
  for (const input of opts.foods) {
    const hash = hashOf(input, opts.attribution, opts.licence);
    const old = byCode.get(input.sourceCode);
    if (old && old.content_hash === hash) counts.unchanged += 1;
    else {
      if (old) counts.updated += 1;
      else counts.inserted += 1;
      pending.push({ input, hash });
    }
  }
  let written = 0;
  for (let i = 0; i < pending.length; i += CHUNK) {
    const chunk = pending.slice(i, i + CHUNK);
    const rows = chunk.map(({ input, hash }) => ({
      source: opts.source,
      sourceCode: input.sourceCode,
      name: input.name,
      foodGroup: input.foodGroup,
      altNames: input.altNames,
      ...input.nutrients,
      carbMeasured: input.carbMeasured,
      carbNote: input.carbNote,
      derived: input.derived,
      attribution: opts.attribution,
      licence: opts.licence,
      importId: opts.importId,
      extra: input.extra,
      contentHash: hash,
      ...searchKeys(input.name, input.altNames),
    }));
    const saved = await FoodModel.bulkCreate(rows, {
      transaction: t,
      hooks: false,
      conflictAttributes: ['source', 'sourceCode'],
      updateOnDuplicate: [
        'name', 'foodGroup', 'altNames', 'energyKcal', 'energyKj', 'carbAvailable', 'carbTotal', 'fibre', 'sugars',
        'protein', 'fat', 'water', 'carbMeasured', 'carbNote', 'derived', 'attribution', 'licence', 'importId',
        'extra', 'contentHash', 'nameKey', 'searchText', 'rankPenalty', 'updatedAt',
      ],
      returning: ['id', 'sourceCode'],
    });
    const ids = saved.map((s) => s.id);
    await FoodMeasureModel.destroy({ where: { foodId: ids }, transaction: t });
    const measures = saved.flatMap((s, k) => chunk[k].input.measures.map((m, seq) => ({ foodId: s.id, label: m.label, grams: m.grams, seq })));
    if (measures.length) await FoodMeasureModel.bulkCreate(measures, { transaction: t, hooks: false });
    written += chunk.length;
    onProgress?.(written);
  }
  return counts;
}
