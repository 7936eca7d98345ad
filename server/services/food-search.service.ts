import { Op, QueryTypes } from 'sequelize';
import type { FoodSearchPage, FoodSearchQuery } from '../../shared/schemas/food';
import type { PreferredFoodTable } from '../../shared/schemas/units';
import { FoodModel, ProfileAccessModel, ProfileModel } from '../models';
import { foodTsQueries, groupQuery, type SynonymPair } from '../search/food-query';
import { normaliseSearchText } from '../search/search-text';
import { toFoodSummary, visibleFoodSql } from './foods.service';



// Fewer hits than this and typo corrections of the words are tried too.
const FUZZY_BELOW = 20;
// A correction must be at least this similar (pg_trgm similarity) to the typed word: "bananna" → "banana" is 0.75,
// "pazam" → "pazham" 0.44, "oats" → "goats" 0.375, so a one-letter slip is corrected and another food's name is not.
const SIMILARITY_FLOOR = 0.4;
// A correction this much less similar than the best one is another word, not what was meant.
const NEAR_MARGIN = 0.25;

/**
 * Up to 3 corrections of a typed word from the lexicon (words of table-food names and aliases), at least
 * SIMILARITY_FLOOR similar (`<->` is 1 − similarity, answered by the lexicon's GiST index). None when the word
 * is itself in the lexicon; none that contain the word (the substring match covers them).
 */
async function nearWords(word: string): Promise<{ word: string; sim: number }[]> {
  const rows = await FoodModel.sequelize!.query<{ word: string; sim: number }>(
    `SELECT word, similarity(word, :word)::float8 AS sim FROM food_words
      WHERE word % :word AND similarity(word, :word) >= :floor ORDER BY word <-> :word, word LIMIT 3`,
    { replacements: { word, floor: SIMILARITY_FLOOR }, type: QueryTypes.SELECT },
  );
  if (!rows.length || rows[0].word === word) return [];
  const best = Number(rows[0].sim);
  return rows.map((r) => ({ word: r.word, sim: Number(r.sim) })).filter((r) => r.sim >= best - NEAR_MARGIN && !r.word.includes(word));
}

/** Synonym pairs whose term or equivalent occurs as whole words in the normalised query. */
async function synonymsFor(q: string): Promise<SynonymPair[]> {
  return FoodModel.sequelize!.query<SynonymPair>(
    `SELECT term, equivalent FROM food_synonyms
      WHERE :padded LIKE '% ' || term || ' %' OR :padded LIKE '% ' || equivalent || ' %'`,
    { replacements: { padded: ` ${q} ` }, type: QueryTypes.SELECT },
  );
}

/** Every other name of a word or phrase in the synonym table, each as its list of words. */
async function otherNames(phrase: string): Promise<string[][]> {
  const pairs = await synonymsFor(phrase);
  return pairs.flatMap((p) => (p.term === phrase ? [p.equivalent] : p.equivalent === phrase ? [p.term] : [])).map((n) => n.split(' '));
}

/**
 * The table whose foods come first: the given profile's choice when the user may open it, else the user's own
 * profile's, else USDA SR28.
 */
export async function preferredTableFor(userId: number, profileId?: number): Promise<PreferredFoodTable> {
  if (profileId) {
    const access = await ProfileAccessModel.findOne({ where: { userId, profileId } });
    if (access) {
      const profile = await ProfileModel.findByPk(profileId, { attributes: ['preferredFoodTable'] });
      if (profile) return profile.preferredFoodTable;
    }
  }
  const own = await ProfileModel.findOne({ where: { ownerUserId: userId }, order: [['id', 'ASC']], attributes: ['preferredFoodTable'] });
  return own?.preferredFoodTable ?? 'usda_sr28';
}

const escapeLike = (s: string) => s.replace(/[\\%_]/g, (c) => `\\${c}`);

/**
 * Ranked, paginated food search.
 * Matching: full-text (english stemming: "apple" finds "Apples, raw"; any word order; the last word also as a prefix
 * while typing), each word or run of words also by its other names from the synonym table; or every word as a
 * substring of the name or an alias; and, when that finds fewer than 20 foods, typo corrections from the lexicon
 * above a similarity floor.
 * Ranking: stemmed match before prefix, substring and corrections; the exact name; a name whose head (the words
 * before its first comma) holds every word, then one; the preferred table; plain raw forms before processed ones and
 * mixtures, generic before branded (rank_penalty); full-text rank; shorter names. The text is only ever bound.
 */
export async function searchFoods(query: FoodSearchQuery, userId: number): Promise<FoodSearchPage> {
  const sequelize = FoodModel.sequelize!;
  const q = normaliseSearchText(query.q);
  const words = q.split(' ').filter(Boolean).slice(0, 8);
  const offset = query.cursor ? Number(query.cursor) : 0;
  // Text made only of punctuation (e.g. "%") matches nothing rather than everything.
  if (!q && query.q.trim()) return { items: [], nextCursor: null };
  const groups = groupQuery(words, q ? await synonymsFor(q) : []);
  const ts = foodTsQueries(groups, true);
  const repl: Record<string, unknown> = {
    userId,
    q,
    tsAll: ts.all,
    tsStrict: ts.strict,
    tsAny: ts.any,
    preferred: await preferredTableFor(userId, query.profileId),
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
  const fullText = q ? `f.search_vector @@ to_tsquery('english', unaccent(:tsAll))` : 'FALSE';
  const scope = `${visibleFoodSql('f', ':userId')}
        AND (CAST(:source AS TEXT) IS NULL OR f.source = CAST(:source AS enum_foods_source))
        AND (CAST(:group AS TEXT) IS NULL OR lower(f.food_group) = lower(:group))`;
  let match = q ? `(${fullText} OR ${allWords})` : 'TRUE';
  let closeness = '';
  if (q) {
    const [{ n }] = await sequelize.query<{ n: number }>(
      `SELECT count(*)::int AS n FROM (SELECT 1 FROM foods f WHERE ${scope} AND ${match} LIMIT ${FUZZY_BELOW}) hits`,
      { replacements: repl, type: QueryTypes.SELECT },
    );
    if (n < FUZZY_BELOW) {
      const perWord: string[] = [];
      const scores: string[] = [];
      let corrections = 0;
      for (const [i, w] of words.entries()) {
        const near = w.length >= 3 ? await nearWords(w) : [];
        corrections += near.length;
        const nearConds: string[] = [];
        for (const [k, { word, sim }] of near.entries()) {
          // A correction matches as a substring, or through its other names (a misspelt "porridge" finds oats).
          const names = [[word], ...(await otherNames(word))];
          nearConds.push(`(${names.map((name, m) => `(${name.map((part, p) => {
            repl[`w${i}n${k}m${m}p${p}`] = `%${escapeLike(part)}%`;
            return `f.search_text LIKE :w${i}n${k}m${m}p${p}`;
          }).join(' AND ')})`).join(' OR ')})`);
          repl[`w${i}s${k}`] = sim;
        }
        perWord.push(`(${[`f.search_text LIKE :w${i}`, ...nearConds].join(' OR ')})`);
        // A word as typed scores 1, a correction its similarity.
        scores.push(`GREATEST(CASE WHEN f.search_text LIKE :w${i} THEN 1 ELSE 0 END${nearConds.map((c, k) => `, CASE WHEN ${c} THEN :w${i}s${k} ELSE 0 END`).join('')})`);
      }
      if (corrections) {
        match = `(${match} OR (${perWord.join(' AND ')}))`;
        closeness = `round((${scores.join(' + ')})::numeric, 1) DESC,`;
      }
    }
  }
  const rows = await sequelize.query<{ id: number }>(
    `SELECT f.id
       FROM foods f
      WHERE ${scope}
        AND ${match}
      ORDER BY
        ${q ? `CASE WHEN f.search_vector @@ to_tsquery('english', unaccent(:tsStrict)) THEN 0
             WHEN ${fullText} THEN 1
             WHEN ${allWords} THEN 2
             ELSE 3 END,
        ${closeness}
        CASE WHEN f.name_key = :q THEN 0 ELSE 1 END,
        CASE WHEN f.head_vector @@ to_tsquery('english', unaccent(:tsStrict)) THEN 0
             WHEN f.head_vector @@ to_tsquery('english', unaccent(:tsAny)) THEN 1
             ELSE 2 END,
        CASE WHEN to_tsvector('english', split_part(f.name_key, ' ', 1)) @@ to_tsquery('english', unaccent(:tsAny)) THEN 0 ELSE 1 END,` : ''}
        CASE WHEN f.source = CAST(:preferred AS enum_foods_source) THEN 0 WHEN f.source = 'pack' THEN 1 ELSE 2 END,
        f.rank_penalty,
        ${q ? `ts_rank_cd(f.search_vector, to_tsquery('english', unaccent(:tsAll))) DESC,` : ''}
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
