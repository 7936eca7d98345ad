import crypto from 'node:crypto';
import jwt from 'jsonwebtoken';
import request from 'supertest';
import { profileActionAllowed, type GrantPermission } from '../../shared/schemas/profile-actions';
import type { ProfileAccessRole } from '../../shared/schemas/auth';
import type { PhotoProcessor } from '../../server/lib/photo-worker';
import type { FileStorage } from '../../server/lib/storage';
import { FoodModel, ProfileAccessModel, RecipeShareModel, RecipeShareOfferModel, UserModel } from '../../server/models';
import { apiRoutes } from '../../server/routes';
import { enabledRoutes, type AnyRoute } from '../../server/routes/registry';
import { createFood, SR_LEGACY, withAvailable } from '../helpers/foods';
import { signUpUser, useTestApp } from '../helpers/api';
import { makeRecipe, overnightOats, postBatch } from './batches-fixtures';

/**
 * The authorization matrix (issue 14 §7): every API route in the registry × every kind of caller. Profile, role,
 * signed-in and public routes get their expectation from the access they declare (profile actions through
 * `profileActionAllowed`, the one rule the server uses); routes whose check lives in a service (recipes, foods,
 * portions, offers) need a row in EXPLICIT. A new route that can be derived from neither fails the test.
 */
const ctx = useTestApp();

const PERSONAS = ['signedOut', 'stranger', 'carer', 'carerSettings', 'clinician', 'clinicianRatios', 'admin', 'owner'] as const;
type Persona = (typeof PERSONAS)[number];
const GRANTS: Partial<Record<Persona, { role: ProfileAccessRole; permissions: GrantPermission[] }>> = {
  owner: { role: 'owner', permissions: [] },
  carer: { role: 'carer', permissions: [] },
  carerSettings: { role: 'carer', permissions: ['settings'] },
  clinician: { role: 'clinician', permissions: [] },
  clinicianRatios: { role: 'clinician', permissions: ['ratios'] },
};

/** `pass` = the access check lets the call through (whatever the handler then answers, but never 401/403/hidden-404/5xx). */
type Expected = number | 'pass';
type Row = Record<Persona, Expected>;

type World = {
  users: Record<Exclude<Persona, 'signedOut'>, UserModel>;
  profileId: number;
  portionCode: string;
};
let world: World;

/** Fresh per row, so a delete in one row cannot change another: a recipe shared with the plain carer, a pack food
 * shared with the profile, an offer to the carer with settings. */
type Fixtures = { recipeId: number; foodId: number; offerId: number; riceId: number };
async function fixtures(): Promise<Fixtures> {
  const { owner, carer, carerSettings } = world.users;
  const rice = await createFood(withAvailable(SR_LEGACY.rice));
  const recipe = await makeRecipe(owner.id, 'Matrix rice', [{ foodId: rice.id, grams: 100 }]);
  await recipe.update({ visibility: 'shared' });
  await RecipeShareModel.create({ recipeId: recipe.id, userId: carer.id, sharedByUserId: owner.id });
  const food = await createFood({ ...withAvailable(SR_LEGACY.rice), name: 'Matrix crackers' });
  await FoodModel.update({ source: 'pack', ownerUserId: owner.id, sharedProfileId: world.profileId }, { where: { id: food.id } });
  const offer = await RecipeShareOfferModel.create({ recipeId: recipe.id, senderUserId: owner.id, email: carerSettings.email });
  return { recipeId: recipe.id, foodId: food.id, offerId: offer.id, riceId: rice.id };
}

const all = (v: Expected, over: Partial<Row> = {}): Row => ({ ...(Object.fromEntries(PERSONAS.map((p) => [p, v])) as Row), signedOut: 401, ...over });
const ownerOnly = (ok: number, viewer: number) => all(404, { carer: viewer, owner: ok });
const LABEL = { name: 'Matrix crackers', basis: 'per100g', convention: 'eu', carbohydrate: 60, fibre: 10 };

/** Service-level checks: the route says "signed in", the service decides. Params and body per row. */
const EXPLICIT: Record<string, { path: (f: Fixtures) => string; body?: object | ((f: Fixtures) => object); expect: Row }> = {
  'GET /recipes/:id': { path: (f) => `/recipes/${f.recipeId}`, expect: ownerOnly(200, 200) },
  'PUT /recipes/:id': {
    path: (f) => `/recipes/${f.recipeId}`,
    body: (f) => ({ title: 'Matrix rice', defaultPortions: 2, visibility: 'shared', ingredients: [{ foodId: f.riceId, grams: 100 }] }),
    expect: ownerOnly(200, 403),
  },
  'DELETE /recipes/:id': { path: (f) => `/recipes/${f.recipeId}`, expect: ownerOnly(204, 403) },
  'POST /recipes/:id/copy': { path: (f) => `/recipes/${f.recipeId}/copy`, expect: ownerOnly(201, 201) },
  // The photo routes: 404 where the recipe is not known to exist, 403 only for someone who may see it.
  'PUT /recipes/:id/photo': { path: (f) => `/recipes/${f.recipeId}/photo`, expect: ownerOnly(400, 403) },
  'DELETE /recipes/:id/photo': { path: (f) => `/recipes/${f.recipeId}/photo`, expect: ownerOnly(204, 403) },
  'GET /recipes/:id/shares': { path: (f) => `/recipes/${f.recipeId}/shares`, expect: ownerOnly(200, 403) },
  'POST /recipes/:id/shares': { path: (f) => `/recipes/${f.recipeId}/shares`, body: { email: 'someone@example.test' }, expect: ownerOnly(202, 403) },
  // The recipe's owner holds no profile as clinician here: past the access check, nobody to offer it to (422).
  'POST /recipes/:id/offers-to-my-people': { path: (f) => `/recipes/${f.recipeId}/offers-to-my-people`, expect: ownerOnly(422, 403) },
  'DELETE /recipes/:id/shares/:userId': { path: (f) => `/recipes/${f.recipeId}/shares/${world.users.carer.id}`, expect: ownerOnly(204, 403) },
  'POST /recipe-offers/:id/accept': { path: (f) => `/recipe-offers/${f.offerId}/accept`, expect: all(404, { carerSettings: 204 }) },
  'POST /recipe-offers/:id/decline': { path: (f) => `/recipe-offers/${f.offerId}/decline`, expect: all(404, { carerSettings: 204 }) },
  // A pack food shared with a profile: its owner and carers see it, a clinician does not.
  'GET /foods/:id': { path: (f) => `/foods/${f.foodId}`, expect: all(404, { owner: 200, carer: 200, carerSettings: 200 }) },
  'GET /foods/:id/photo': { path: (f) => `/foods/${f.foodId}`, expect: all(404, { owner: 200, carer: 200, carerSettings: 200 }) },
  'PUT /foods/:id': { path: (f) => `/foods/${f.foodId}`, body: LABEL, expect: all(404, { owner: 200 }) },
  'DELETE /foods/:id': { path: (f) => `/foods/${f.foodId}`, expect: all(404, { owner: 204 }) },
  'GET /portions/:code': { path: () => `/portions/${world.portionCode}`, expect: all(200, { stranger: 404, admin: 404 }) },
  'POST /portions/:code/status': {
    path: () => `/portions/${world.portionCode}/status`,
    // The portion is already available: 409 shows the call got past the access check.
    body: { status: 'available' },
    expect: all(409, { stranger: 404, admin: 404, clinician: 403, clinicianRatios: 403 }),
  },
};

/** What a route's declared access says each caller gets; undefined when it cannot be derived (needs a row). */
function derive(route: AnyRoute): Row | undefined {
  const a = route.access;
  switch (a.kind) {
    case 'public':
      return { ...all('pass'), signedOut: 'pass' };
    case 'signed-link':
      return undefined;
    case 'role':
      return all(403, a.roles.includes('admin') ? { admin: 'pass' } : {});
    case 'profile': {
      const row = all(404);
      for (const [p, grant] of Object.entries(GRANTS)) row[p as Persona] = profileActionAllowed(grant!, a.action) ? 'pass' : 403;
      return row;
    }
    case 'signed-in':
      return /:\w+/.test(route.path) ? undefined : all('pass');
  }
}

function tokenFor(user: UserModel): string {
  // A fresh token per call, so a sign-out in one row does not sign the caller out of the next.
  return jwt.sign({ tv: user.tokenVersion, jti: crypto.randomBytes(16).toString('hex') }, ctx.config.jwtSecret, { algorithm: 'HS256', subject: String(user.id), expiresIn: 600 });
}

function fillPath(path: string): string {
  return path
    .replace(':profileId', String(world.profileId))
    .replace(':token', 'x'.repeat(43))
    .replace(':date', '2026-03-02')
    .replace(/:\w+/g, '999999');
}

async function call(persona: Persona, method: string, path: string, body?: object) {
  let req = request(ctx.app)[method as 'get'](`/api${path}`);
  if (persona !== 'signedOut') req = req.set('Authorization', `Bearer ${tokenFor(await world.users[persona].reload())}`);
  return body ? req.send(body) : req;
}

const isHidden = (res: request.Response) => res.status === 404 && /profile was not found/.test(res.body?.error?.message ?? '');

beforeAll(async () => {
  const made = {} as World['users'];
  for (const p of PERSONAS) if (p !== 'signedOut') made[p] = (await UserModel.findByPk((await signUpUser(ctx.app, p)).me.user.id))!;
  await made.admin.update({ role: 'admin' });
  for (const p of ['clinician', 'clinicianRatios'] as const) await made[p].update({ role: 'clinician' });
  const profileId = (await ProfileAccessModel.findOne({ where: { userId: made.owner.id, role: 'owner' } }))!.profileId;
  for (const [p, grant] of Object.entries(GRANTS)) {
    if (p !== 'owner') await ProfileAccessModel.create({ profileId, userId: made[p as Persona & keyof World['users']].id, role: grant!.role, permissions: grant!.permissions, grantedByUserId: made.owner.id });
  }
  world = { users: made, profileId, portionCode: '' };
  const oats = await overnightOats(made.owner.id);
  const batch = await postBatch(ctx.app, tokenFor(made.owner), profileId, oats.input);
  world.portionCode = batch.body.portions[0].code;
});

const deps = { config: undefined as never, sequelize: undefined as never, storage: {} as FileStorage, photos: {} as PhotoProcessor };
const routes = () => enabledRoutes(apiRoutes({ ...deps, config: ctx.config, sequelize: ctx.sequelize }), ctx.config);

describe('the authorization matrix', () => {
  it('has an expectation for every route: derived from its declared access, or an explicit row', () => {
    const missing = routes()
      .filter((r) => r.access.kind !== 'signed-link' && !EXPLICIT[`${r.method.toUpperCase()} ${r.path}`] && !derive(r))
      .map((r) => `${r.method.toUpperCase()} ${r.path}`);
    const stale = Object.keys(EXPLICIT).filter((key) => !routes().some((r) => `${r.method.toUpperCase()} ${r.path}` === key));

    expect(missing).toEqual([]);
    expect(stale).toEqual([]);
  });

  it('answers each caller as the matrix says, on every route', async () => {
    const failures: string[] = [];
    for (const route of routes()) {
      const key = `${route.method.toUpperCase()} ${route.path}`;
      const explicit = EXPLICIT[key];
      const row = explicit?.expect ?? derive(route);
      if (!row) continue;
      const f = explicit ? await fixtures() : undefined;
      const path = explicit ? explicit.path(f!) : fillPath(route.path);
      const body = typeof explicit?.body === 'function' ? explicit.body(f!) : explicit?.body;
      for (const persona of PERSONAS) {
        const res = await call(persona, route.method, path, body ?? (['get', 'delete'].includes(route.method) ? undefined : {}));
        const want = row[persona];
        const ok = want === 'pass' ? res.status < 500 && res.status !== 401 && res.status !== 403 && !isHidden(res) : res.status === want;
        if (!ok) failures.push(`${key} as ${persona}: ${res.status} (expected ${want}) ${JSON.stringify(res.body?.error?.message ?? '')}`);
      }
    }
    expect(failures).toEqual([]);
  }, 300_000);

  it('answers a signed link the same whoever calls, and never 5xx', async () => {
    for (const route of routes().filter((r) => r.access.kind === 'signed-link')) {
      const statuses = new Set<number>();
      for (const persona of PERSONAS) statuses.add((await call(persona, route.method, fillPath(route.path))).status);
      expect([...statuses]).toHaveLength(1);
      expect([...statuses][0]).toBeLessThan(500);
    }
  });
});
