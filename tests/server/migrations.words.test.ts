import request from 'supertest';
import * as m0425 from '../../server/migrations/0425-pack-food-source';
import * as m0426 from '../../server/migrations/0426-times-of-day';
import { FoodModel } from '../../server/models';
import { bearer, signUpMember, useTestApp } from '../helpers/api';
import { createFood } from '../helpers/foods';

const ctx = useTestApp();

const one = async (sql: string) => ((await ctx.sequelize.query(sql))[0] as Record<string, unknown>[])[0];

// Issue 9 renamed words in the database: food source 'label' → 'pack' (0425), table ratio_blocks → times_of_day
// and the history key blocks → timesOfDay (0426). Both go down and up again without losing a row.
describe('migrations 0425-pack-food-source and 0426-times-of-day', () => {
  it('go down to the old names and up again, keeping the pack food, the times of day and the history', async () => {
    const cook = await signUpMember(ctx.app, 'Cook');
    const timesOfDay = [{ from: '00:00', to: '24:00', carbRatio: 10, correctionFactor: 2 }];
    const kind = { name: 'Rest', isDefault: true, longActingUnits: null, glucoseUnit: 'mmol_l', timesOfDay };
    const created = await request(ctx.app).post(`/api/profiles/${cook.profileId}/day-kinds`).set(bearer(cook.token)).send(kind);
    expect(created.status).toBe(201);
    const food = await createFood({ name: 'Oat crackers', carbTotal: 60, fibre: 5, ownerUserId: cook.userId });
    const context = ctx.sequelize.getQueryInterface();

    await m0426.down({ context });
    await m0425.down({ context });
    const down = {
      source: await one(`SELECT source FROM foods WHERE id = ${food.id}`),
      ratio: await one('SELECT carb_ratio FROM ratio_blocks'),
      history: await one("SELECT new_value ? 'blocks' AS old_key, new_value ? 'timesOfDay' AS new_key FROM settings_changes WHERE subject = 'day_kind'"),
    };
    await m0425.up({ context });
    await m0426.up({ context });

    expect(down).toEqual({ source: { source: 'label' }, ratio: { carb_ratio: 10 }, history: { old_key: true, new_key: false } });
    expect((await FoodModel.findByPk(food.id))!.source).toBe('pack');
    const history = await request(ctx.app).get(`/api/profiles/${cook.profileId}/settings/history`).set(bearer(cook.token));
    const list = await request(ctx.app).get(`/api/profiles/${cook.profileId}/day-kinds`).set(bearer(cook.token));
    expect(list.body.dayKinds[0].timesOfDay).toEqual(timesOfDay);
    expect(history.body.changes[0].changes.map((c: { field: string }) => c.field)).toContain('timesOfDay.0.carbRatio');
  });
});
