import { Writable } from 'node:stream';
import pino from 'pino';
import request from 'supertest';
import { DatabaseError, UniqueConstraintError } from 'sequelize';
import { REDACT_PATHS } from '../../server/logger';
import { RecipeModel } from '../../server/models';
import { bearer, signUpMember, useTestApp, useUploadsDir } from '../helpers/api';
import { makeImage } from '../fixtures/photos/make-images';
import { createRecipeAs, insertOatsFoods, oatsRecipe } from './recipes-helpers';

jest.setTimeout(120_000);

const uploads = useUploadsDir();
const ctx = useTestApp({ UPLOADS_DIR: uploads });

describe('API responses (OWASP ASVS 4.0 V7, V8, V12, V14)', () => {
  it('are never stored by a browser or proxy (Cache-Control: no-store), errors included', async () => {
    const cook = await signUpMember(ctx.app, 'Private');
    const answers = [
      await request(ctx.app).get('/api/me').set(bearer(cook.token)),
      await request(ctx.app).get(`/api/profiles/${cook.profileId}/settings`).set(bearer(cook.token)),
      await request(ctx.app).get('/api/recipes').set(bearer(cook.token)),
      await request(ctx.app).get('/api/recipes'),
    ];
    for (const res of answers) expect(res.headers['cache-control']).toBe('no-store');
  });

  it('serve an uploaded photo only as an image type, with nosniff', async () => {
    const cook = await signUpMember(ctx.app, 'Photo');
    const foods = await insertOatsFoods();
    const { id } = await createRecipeAs(ctx.app, cook.token, oatsRecipe(foods));
    const put = await request(ctx.app).put(`/api/recipes/${id}/photo`).set(bearer(cook.token)).attach('photo', await makeImage(200, 100), 'x.html');

    const photo = await request(ctx.app).get(put.body.largeUrl);

    expect(photo.status).toBe(200);
    expect(photo.headers['content-type']).toBe('image/jpeg');
    expect(photo.headers['x-content-type-options']).toBe('nosniff');
  });

  it('carry no stack trace and no SQL when the database fails', async () => {
    const cook = await signUpMember(ctx.app, 'Broken');
    const failure = new DatabaseError(Object.assign(new Error('relation "recipes" does not exist'), { sql: 'SELECT * FROM recipes WHERE owner_user_id = 1', parameters: [1] }) as never);
    const spy = jest.spyOn(RecipeModel, 'findAll').mockRejectedValueOnce(failure);
    try {
      const res = await request(ctx.app).get('/api/recipes').set(bearer(cook.token));

      expect(res.status).toBe(500);
      expect(res.body).toEqual({ error: { code: 'internal', message: 'Something went wrong on our side. Please try again.' } });
      expect(res.text).not.toMatch(/SELECT|recipes|\bat \w|\.ts:\d/);
    } finally {
      spy.mockRestore();
    }
  });
});

describe('the log', () => {
  it('keeps the stack and drops e-mails, glucose, doses and the SQL values of a database error', () => {
    const lines: string[] = [];
    const sink = new Writable({ write: (chunk, _enc, done) => (lines.push(String(chunk)), done()) });
    const log = pino({ redact: REDACT_PATHS }, sink);
    const original = Object.assign(new Error('duplicate key value violates unique constraint "users_email_key"'), {
      detail: 'Key (email)=(ana@example.test) already exists.',
      sql: "INSERT INTO users (email) VALUES ('ana@example.test')",
      parameters: ['ana@example.test'],
    });
    const err = new UniqueConstraintError({ parent: original as never, fields: { email: 'ana@example.test' } });

    log.error({ err, request: { email: 'ana@example.test', glucoseMmol: 4.2, carbsGrams: 60, units: 6 } }, 'unhandled error');

    const text = lines.join('');
    expect(text).toContain('"stack"');
    expect(text).toContain('unique constraint');
    expect(text).not.toContain('ana@example.test');
    expect(text).not.toMatch(/4\.2|"carbsGrams":60|"units":6/);
    expect(text).toContain('[Redacted]');
  });
});
