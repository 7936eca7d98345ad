import { Op, QueryTypes } from 'sequelize';
import type { WhereOptions } from 'sequelize';
import type { Food, FoodSearchPage, FoodSearchQuery, FoodSummary } from '../../shared/schemas/food';
import { AppError } from '../errors';
import { FoodMeasureModel, FoodModel, ProfileAccessModel } from '../models';
import { normaliseSearchText } from '../importers/food-rows';

/** Maps a food row to the API shape, without measures. */
export function toFoodSummary(f: FoodModel): FoodSummary {
  return {
    id: f.id,
    name: f.name,
    source: f.source,
    sourceCode: f.sourceCode,
    group: f.foodGroup,
    altNames: f.altNames ?? [],
    per100g: {
      energyKcal: f.energyKcal,
      energyKj: f.energyKj,
      carbAvailable: f.carbAvailable,
      carbTotal: f.carbTotal,
      fibre: f.fibre,
      sugars: f.sugars,
      protein: f.protein,
      fat: f.fat,
      water: f.water,
    },
    carbMeasured: f.carbMeasured,
    carbNote: f.carbNote ?? null,
    derived: f.derived ?? [],
    attribution: f.attribution,
    licence: f.licence,
    ownerUserId: f.ownerUserId ?? null,
    sharedProfileId: f.sharedProfileId ?? null,
    labelConvention: f.labelConvention ?? null,
    hasPhoto: Boolean(f.photoPath),
    scientificName: f.extra?.scientificName ?? null,
    ndbNumber: f.extra?.ndbNumber ?? null,
    brand: f.extra?.brand ?? null,
    carbStarchSugars: f.extra?.carbStarchSugars ?? null,
  };
}

/** Maps a food model with its measures loaded to the API shape. */
export function toFood(f: FoodModel): Food {
  const measures = [...(f.measures ?? [])].sort((a, b) => a.seq - b.seq).map((m) => ({ label: m.label, grams: m.grams }));
  return { ...toFoodSummary(f), measures };
}

/** Profiles whose care team the user belongs to (owner, carer or clinician). */
async function profileIdsOf(userId: number): Promise<number[]> {
  const rows = await ProfileAccessModel.findAll({ where: { userId }, attributes: ['profileId'], raw: true });
  return rows.map((r) => r.profileId);
}

/** The visibility rule: every table food; label foods the user owns or that are shared with a profile they can open. */
async function visibleWhere(userId: number): Promise<WhereOptions<FoodModel>> {
  const profileIds = await profileIdsOf(userId);
  const or: WhereOptions<FoodModel>[] = [{ ownerUserId: null }, { ownerUserId: userId }];
  if (profileIds.length) or.push({ sharedProfileId: { [Op.in]: profileIds } });
  return { [Op.or]: or };
}

/**
 * Foods a user may use in a recipe, keyed by id: every table food, and label foods they own or that are
 * shared with a profile they have access to. Ids the user may not use (or that do not exist) are absent.
 */
export async function getUsableFoods(ids: number[], userId: number): Promise<Map<number, Food>> {
  const unique = [...new Set(ids)].filter((id) => Number.isInteger(id) && id > 0);
  const out = new Map<number, Food>();
  if (!unique.length) return out;
  const rows = await FoodModel.findAll({
    where: { [Op.and]: [{ id: { [Op.in]: unique } }, await visibleWhere(userId)] },
    include: [{ model: FoodMeasureModel, as: 'measures' }],
  });
  for (const row of rows) out.set(row.id, toFood(row));
  return out;
}

/** One food with its measures, or 404 when it does not exist or the user may not see it. */
export async function getFood(id: number, userId: number): Promise<Food> {
  const food = (await getUsableFoods([id], userId)).get(id);
  if (!food) throw AppError.notFound('food');
  return food;
}

/** The stored photo path of a label food the user may see, or 404. */
export async function getFoodPhotoPath(id: number, userId: number): Promise<string> {
  const row = await FoodModel.findOne({ where: { [Op.and]: [{ id }, await visibleWhere(userId)] }, attributes: ['photoPath'] });
  if (!row?.photoPath) throw AppError.notFound('photo');
  return row.photoPath;
}

const FUZZY_BELOW = 20;

// A correction this much less similar than the best one is another word, not what was meant.
const NEAR_MARGIN = 0.25;

/**
 * Up to 3 corrections of a typed word from the lexicon (words of table-food names and aliases), with their
 * pg_trgm similarity (≥ its default 0.3; `<->` is 1 − similarity, answered by the lexicon's GiST index).
 * None when the word is itself in the lexicon; none that contain the word (its substring match covers them).
 */
async function nearWords(word: string): Promise<{ word: string; sim: number }[]> {
  const rows = await FoodModel.sequelize!.query<{ word: string; sim: number }>(
    'SELECT word, similarity(word, :word)::float8 AS sim FROM food_words WHERE word % :word ORDER BY word <-> :word, word LIMIT 3',
    { replacements: { word }, type: QueryTypes.SELECT },
  );
  if (!rows.length || rows[0].word === word) return [];
  const best = Number(rows[0].sim);
  return rows.map((r) => ({ word: r.word, sim: Number(r.sim) })).filter((r) => r.sim >= best - NEAR_MARGIN && !r.word.includes(word));
}
const escapeLike = (s: string) => s.replace(/[\\%_]/g, (c) => `\\${c}`);

/**
 * Ranked, paginated food search. Matching: every word as a substring of the name or an alias (prefix-as-you-type);
 * when that finds fewer than 20 foods, each word may also be one of its nearest lexicon words (typos in names and
 * aliases). Ranking: exact name, name prefix, word prefix, substring, fuzzy (closer corrections first); within a tier
 * plain raw foods before processed variants (rank_penalty), then closeness and shorter names.
 * The text is only ever a bound parameter.
 */
export async function searchFoods(query: FoodSearchQuery, userId: number): Promise<FoodSearchPage> {
  const sequelize = FoodModel.sequelize!;
  const q = normaliseSearchText(query.q);
  const words = q.split(' ').filter(Boolean).slice(0, 8);
  const offset = query.cursor ? Number(query.cursor) : 0;
  // Text made only of punctuation (e.g. "%") matches nothing rather than everything.
  if (!q && query.q.trim()) return { items: [], nextCursor: null };
  const profileIds = await profileIdsOf(userId);
  const repl: Record<string, unknown> = {
    userId,
    profileIds: profileIds.length ? profileIds : [0],
    q,
    exact: q,
    prefix: `${escapeLike(q)}%`,
    wordPrefix: `% ${escapeLike(q)}%`,
    contains: `%${escapeLike(q)}%`,
    limit: query.limit + 1,
    offset,
    source: query.source ?? null,
    group: query.group ?? null,
  };
  const wordConds = words.map((w, i) => {
    repl[`w${i}`] = `%${escapeLike(w)}%`;
    return `f.search_text LIKE :w${i}`;
  });
  const allWords = wordConds.length ? wordConds.join(' AND ') : 'TRUE';
  const scope = `(f.owner_user_id IS NULL OR f.owner_user_id = :userId OR f.shared_profile_id IN (:profileIds))
        AND (CAST(:source AS TEXT) IS NULL OR f.source = CAST(:source AS enum_foods_source))
        AND (CAST(:group AS TEXT) IS NULL OR lower(f.food_group) = lower(:group))`;
  // Typos: when the words as typed match too few foods, each word may also match its nearest words in the
  // table's lexicon (trigram similarity on short strings, index-backed), searched as substrings like the rest.
  let match = allWords;
  let closeness = '';
  if (q) {
    const [{ n }] = await sequelize.query<{ n: number }>(
      `SELECT count(*)::int AS n FROM (SELECT 1 FROM foods f WHERE ${scope} AND ${allWords} LIMIT ${FUZZY_BELOW}) hits`,
      { replacements: repl, type: QueryTypes.SELECT },
    );
    if (n < FUZZY_BELOW) {
      const perWord: string[] = [];
      const scores: string[] = [];
      let corrections = 0;
      for (const [i, w] of words.entries()) {
        const near = w.length >= 3 ? await nearWords(w) : [];
        corrections += near.length;
        near.forEach(({ word, sim }, k) => {
          repl[`w${i}n${k}`] = `%${escapeLike(word)}%`;
          repl[`w${i}s${k}`] = sim;
        });
        perWord.push(`(${[`f.search_text LIKE :w${i}`, ...near.map((_, k) => `f.search_text LIKE :w${i}n${k}`)].join(' OR ')})`);
        // A word as typed scores 1, a correction its similarity: a near-miss of a rare local name outranks a
        // short common word that only resembles it, whatever the rank penalty of the foods carrying them.
        scores.push(`GREATEST(CASE WHEN f.search_text LIKE :w${i} THEN 1 ELSE 0 END${near.map((_, k) => `, CASE WHEN f.search_text LIKE :w${i}n${k} THEN :w${i}s${k} ELSE 0 END`).join('')})`);
      }
      if (corrections) {
        match = perWord.join(' AND ');
        closeness = `round((${scores.join(' + ')})::numeric, 1) DESC,`;
      }
    }
  }
  const rows = await sequelize.query<Record<string, unknown>>(
    `SELECT f.id
       FROM foods f
      WHERE ${scope}
        AND ${match}
      ORDER BY
        CASE WHEN :q = '' THEN 0
             WHEN f.name_key = :exact THEN 0
             WHEN f.name_key LIKE :prefix THEN 1
             WHEN (' ' || f.search_text) LIKE :wordPrefix THEN 2
             WHEN ${allWords} THEN 3
             ELSE 4 END,
        ${closeness}
        f.rank_penalty,
        ${q ? 'similarity(:q, f.name_key) DESC,' : ''}
        length(f.name),
        f.id
      LIMIT :limit OFFSET :offset`,
    { replacements: repl, type: QueryTypes.SELECT },
  );
  const ids = rows.map((r) => Number(r.id));
  const more = ids.length > query.limit;
  const pageIds = ids.slice(0, query.limit);
  const found = await FoodModel.findAll({ where: { id: { [Op.in]: pageIds.length ? pageIds : [0] } } });
  const byId = new Map(found.map((f) => [f.id, f]));
  return {
    items: pageIds.flatMap((id) => (byId.has(id) ? [toFoodSummary(byId.get(id)!)] : [])),
    nextCursor: more ? String(offset + query.limit) : null,
  };
}
