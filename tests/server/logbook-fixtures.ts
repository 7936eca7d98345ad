import request from 'supertest';
import type { Express } from 'express';
import { bearer, signUpMember } from '../helpers/api';
import { TEST_DOSE_SETTINGS } from '../helpers/dose-settings';
import { overnightOats, postBatch } from './batches-fixtures';

const kind = (name: string, carbRatio: number, isDefault: boolean) => ({
  name,
  isDefault,
  longActingUnits: isDefault ? 14 : 12,
  glucoseUnit: 'mmol_l',
  timesOfDay: [{ from: '00:00', to: '24:00', carbRatio, correctionFactor: 2 }],
});

/**
 * A member whose profile lives in Europe/London with the invented test settings, two day kinds (Rest, the default, and
 * Training) and a batch of overnight oats in five jars; `codes` are the jars' portion codes.
 */
export async function breakfastProfile(app: Express, name = 'Breakfast') {
  const m = await signUpMember(app, name);
  await request(app).put(`/api/profiles/${m.profileId}/settings`).set(bearer(m.token)).send({ ...TEST_DOSE_SETTINGS, timeZone: 'Europe/London' }).expect(200);
  const rest = await request(app).post(`/api/profiles/${m.profileId}/day-kinds`).set(bearer(m.token)).send(kind('Rest', 10, true)).expect(201);
  const training = await request(app).post(`/api/profiles/${m.profileId}/day-kinds`).set(bearer(m.token)).send(kind('Training', 15, false)).expect(201);
  const { input } = await overnightOats(m.userId);
  const batch = await postBatch(app, m.token, m.profileId, input);
  return {
    ...m,
    restId: rest.body.id as number,
    trainingId: training.body.id as number,
    batchId: batch.body.id as number,
    recipeId: input.recipeId,
    codes: (batch.body.portions as { code: string }[]).map((p) => p.code),
  };
}

/** A dose suggestion as the API answered it (its caution and engine versions), to store beside the dose taken. */
export const SHOWN = { status: 'ok', caution: { version: 'test-caution-1', title: 't', text: 't' }, engineVersion: 'test-engine-1', breakdown: { doseUnits: 4 } };
