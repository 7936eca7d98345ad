import { QueryTypes } from 'sequelize';
import type { FoodSearchPage, FoodSearchQuery } from '../../shared/schemas/food';
import type { PreferredFoodTable } from '../../shared/schemas/units';
import { FoodModel } from '../models';
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

type Correction = { word: string; sim: number; others: string[][] };

/**
 * For each typed word of 3 letters or more, up to 3 corrections from the lexicon (words of table-food names, aliases
 * and synonyms), at least SIMILARITY_FLOOR similar (`<->` is 1 − similarity, answered by the lexicon's GiST index),
 * each with its other names from the synonym table (as lists of words); one query for every word. None for a word
 * that is itself in the lexicon; none that contain the word (the substring match covers them).
 */
async function corrections(words: string[]): Promise<Map<number, Correction[]>> {
  const out = new Map<number, Correction[]>();
  const asked = words.map((w, i) => ({ w, i })).filter(({ w }) => w.length >= 3);
  if (!asked.length) return out;
  const rows = await FoodModel.sequelize!.query<{ i: number; word: string; sim: number; others: string[] }>(
    `SELECT q.i, n.word, n.sim,
            COALESCE((SELECT json_agg(CASE WHEN s.term = n.word THEN s.equivalent ELSE s.term END) FROM food_synonyms s
                       WHERE s.term = n.word OR s.equivalent = n.word), '[]'::json) AS others
       FROM unnest(CAST(:words AS text[]), CAST(:positions AS int[])) AS q(w, i)
       CROSS JOIN LATERAL (SELECT word, similarity(word, q.w)::float8 AS sim FROM food_words
                            WHERE word % q.w AND similarity(word, q.w) >= :floor ORDER BY word <-> q.w, word LIMIT 3) n
      ORDER BY q.i, n.sim DESC, n.word`,
    {
      replacements: { words: `{${asked.map(({ w }) => `"${w}"`).join(',')}}`, positions: `{${asked.map(({ i }) => i).join(',')}}`, floor: SIMILARITY_FLOOR },
      type: QueryTypes.SELECT,
    },
  );
  for (const { w, i } of asked) {
    const near = rows.filter((r) => Number(r.i) === i);
    if (!near.length || near[0].word === w) continue;
    const best = Number(near[0].sim);
    out.set(
      i,
      near
        .filter((r) => Number(r.sim) >= best - NEAR_MARGIN && !r.word.includes(w))
        .map((r) => ({ word: r.word, sim: Number(r.sim), others: r.others.map((n) => n.split(' ')) })),
    );
  }
  return out;
}

// A synonym pair whose term or equivalent occurs as whole words in :padded (the normalised query between spaces).
const SYNONYM_MATCH = `:padded LIKE '% ' || term || ' %' OR :padded LIKE '% ' || equivalent || ' %'`;

/**
 * The table whose foods come first, as SQL: the given profile's choice when the user may open it, else the user's own
 * profile's, else USDA SR28. `userId` and `profileId` must be bound parameters (profileId may be NULL).
 */
function preferredTableSql(userId: string, profileId: string): string {
  return `COALESCE(
    (SELECT p.preferred_food_table::text FROM profiles p
      WHERE p.id = CAST(${profileId} AS int) AND EXISTS (SELECT 1 FROM profile_access pa WHERE pa.profile_id = p.id AND pa.user_id = ${userId})),
    (SELECT p.preferred_food_table::text FROM profiles p WHERE p.owner_user_id = ${userId} ORDER BY p.id LIMIT 1),
    'usda_sr28')`;
}

/**
 * The table whose foods come first: the given profile's choice when the user may open it, else the user's own
 * profile's, else USDA SR28.
 */
export async function preferredTableFor(userId: number, profileId?: number): Promise<PreferredFoodTable> {
  const [row] = await FoodModel.sequelize!.query<{ preferred: PreferredFoodTable }>(`SELECT ${preferredTableSql(':userId', ':profileId')} AS preferred`, {
    replacements: { userId, profileId: profileId ?? null },
    type: QueryTypes.SELECT,
  });
  return row.preferred;
}

/** The preferred table and the synonym pairs whose term or equivalent occurs as whole words in the query, in one round trip. */
async function searchContext(q: string, userId: number, profileId?: number): Promise<{ preferred: PreferredFoodTable; synonyms: SynonymPair[] }> {
  const [row] = await FoodModel.sequelize!.query<{ preferred: PreferredFoodTable; synonyms: SynonymPair[] }>(
    `SELECT ${preferredTableSql(':userId', ':profileId')} AS preferred,
            COALESCE((SELECT json_agg(json_build_object('term', term, 'equivalent', equivalent)) FROM food_synonyms
                       WHERE ${SYNONYM_MATCH}), '[]'::json) AS synonyms`,
    { replacements: { userId, profileId: profileId ?? null, padded: ` ${q} ` }, type: QueryTypes.SELECT },
  );
  return { preferred: row.preferred, synonyms: q ? row.synonyms : [] };
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
  const { preferred, synonyms } = await searchContext(q, userId, query.profileId);
  const groups = groupQuery(words, synonyms);
  const ts = foodTsQueries(groups, true);
  const repl: Record<string, unknown> = {
    userId,
    q,
    tsAll: ts.all,
    tsStrict: ts.strict,
    tsAny: ts.any,
    preferred,
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
  // The tsqueries are made once per statement (a MATERIALIZED CTE): unaccent() is only STABLE, so written inline
  // to_tsquery('english', unaccent(…)) was parsed again for every candidate row and every sort key.
  const queries = q
    ? `WITH qs AS MATERIALIZED (SELECT to_tsquery('english', unaccent(:tsAll)) AS q_all,
                                       to_tsquery('english', unaccent(:tsStrict)) AS q_strict,
                                       to_tsquery('english', unaccent(:tsAny)) AS q_any)`
    : '';
  const fullText = q ? 'f.search_vector @@ qs.q_all' : 'FALSE';
  const scope = `${visibleFoodSql('f', ':userId')}
        AND (CAST(:source AS TEXT) IS NULL OR f.source = CAST(:source AS enum_foods_source))
        AND (CAST(:group AS TEXT) IS NULL OR lower(f.food_group) = lower(:group))`;
  // The order, first to last: sort keys that are cheap to work out for every match, then the full-text rank (costly:
  // worked out only for the matches that can still reach the page, see below), the shorter name, the id.
  const cheapKeys = (closeness: string | null) => [
    ...(q
      ? [
          `CASE WHEN f.search_vector @@ qs.q_strict THEN 0 WHEN ${fullText} THEN 1 WHEN ${allWords} THEN 2 ELSE 3 END`,
          ...(closeness ? [closeness] : []),
          'CASE WHEN f.name_key = :q THEN 0 ELSE 1 END',
          'CASE WHEN f.head_vector @@ qs.q_strict THEN 0 WHEN f.head_vector @@ qs.q_any THEN 1 ELSE 2 END',
          'CASE WHEN f.first_word_vector @@ qs.q_any THEN 0 ELSE 1 END',
        ]
      : []),
    "CASE WHEN f.source = CAST(:preferred AS enum_foods_source) THEN 0 WHEN f.source = 'pack' THEN 1 ELSE 2 END",
    'f.rank_penalty',
  ];
  /**
   * One statement: the matches with their cheap keys (hits: the full-text matches, and the others only when the
   * full-text ones are too few to fill the page and to decide on corrections, as every other match ranks after every
   * full-text one; so `total` is the number of matches, or of the full-text ones when that is at least FUZZY_BELOW and
   * the page); the key tuple of the last row the page needs (cut); the
   * full order only for hits whose tuple is not after the cut (a hit after it has at least offset + limit hits before
   * it, so it cannot reach the page: the page is exactly that of ordering every match); then the page's foods, in that
   * order, with the number of matches.
   */
  const ranked = (match: string, closeness: string | null) => {
    const keys = cheapKeys(closeness).map((expr, i) => ({ expr, name: `k${i}` }));
    const names = keys.map((k) => k.name).join(', ');
    const hitsSql = (where: string) => `
        SELECT f.id, ${keys.map((k) => `${k.expr} AS ${k.name}`).join(', ')}
          FROM ${q ? 'qs, ' : ''}foods f
         WHERE ${scope}
           AND ${where}`;
    return sequelize.query<FoodModel & { total: string }>(
      `${q ? `${queries},` : 'WITH'}
      ${q ? `text_hits AS MATERIALIZED (${hitsSql(`${fullText}`)}),
      other_hits AS MATERIALIZED (${hitsSql(`${match} AND NOT (${fullText})`)}
           AND (SELECT count(*) FROM text_hits) < GREATEST(:limit + :offset, ${FUZZY_BELOW})),
      hits AS (SELECT * FROM text_hits UNION ALL SELECT * FROM other_hits),` : `hits AS MATERIALIZED (${hitsSql(match)}),`}
      cut AS (SELECT ${names} FROM hits ORDER BY ${names} OFFSET :limit + :offset - 1 LIMIT 1)
     SELECT ${foodColumns()}, page.total
       FROM (SELECT hit.id, hit.total, row_number() OVER () AS pos FROM (
               SELECT f.id, (SELECT count(*) FROM hits) AS total
                 FROM ${q ? 'qs, ' : ''}hits h JOIN foods f ON f.id = h.id
                WHERE NOT EXISTS (SELECT 1 FROM cut) OR (${keys.map((k) => `h.${k.name}`).join(', ')}) <= (SELECT ${names} FROM cut)
                ORDER BY ${keys.map((k) => `h.${k.name}`).join(', ')},
                         ${q ? 'ts_rank_cd(f.search_vector, qs.q_all) DESC,' : ''}
                         length(f.name), f.id
                LIMIT :limit OFFSET :offset) hit) page
       JOIN foods f ON f.id = page.id
      ORDER BY page.pos`,
      { replacements: repl, type: QueryTypes.SELECT },
    );
  };
  const match = q ? `(${fullText} OR ${allWords})` : 'TRUE';
  let rows = await ranked(match, null);
  if (q) {
    // The number of matches decides whether typo corrections are tried; a page past the end carries no count.
    const n = rows.length ? Number(rows[0].total) : offset === 0 ? 0 : await countMatches(scope, queries, match, repl);
    if (n < FUZZY_BELOW) {
      const perWord: string[] = [];
      const scores: string[] = [];
      let found = 0;
      const nearOf = await corrections(words);
      for (let i = 0; i < words.length; i++) {
        const near = nearOf.get(i) ?? [];
        found += near.length;
        const nearConds: string[] = [];
        for (const [k, { word, sim, others }] of near.entries()) {
          // A correction matches as a substring, or through its other names (a misspelt "porridge" finds oats).
          const names = [[word], ...others];
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
      if (found) rows = await ranked(`(${match} OR (${perWord.join(' AND ')}))`, `-round((${scores.join(' + ')})::numeric, 1)`);
    }
  }
  const more = rows.length > query.limit;
  return {
    items: rows.slice(0, query.limit).map((f) => toFoodSummary(f)),
    nextCursor: more ? String(offset + query.limit) : null,
  };
}

/** How many foods match (up to FUZZY_BELOW), for a page past the last match. */
async function countMatches(scope: string, queries: string, match: string, repl: Record<string, unknown>): Promise<number> {
  const [{ n }] = await FoodModel.sequelize!.query<{ n: number }>(
    `${queries} SELECT count(*)::int AS n FROM (SELECT 1 FROM qs, foods f WHERE ${scope} AND ${match} LIMIT ${FUZZY_BELOW}) hits`,
    { replacements: repl, type: QueryTypes.SELECT },
  );
  return n;
}

let columnList: string | null = null;
/** Every column of the foods model, named as a raw FoodModel row names it (as toFoodSummary reads it). */
function foodColumns(): string {
  columnList ??= Object.entries(FoodModel.getAttributes())
    .map(([name, a]) => `f."${a.field ?? name}" AS "${name}"`)
    .join(', ');
  return columnList;
}
