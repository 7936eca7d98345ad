import { FoodModel, ProfileAccessModel } from '../../server/models';
import { getUsableFoods } from '../../server/services/foods.service';
import { signUpUser, useTestApp } from '../helpers/api';

const ctx = useTestApp();

// Invented values: these rows only exercise who may use which food.
const base = {
  energyKcal: 100, energyKj: 418, carbAvailable: 10, carbTotal: 12, fibre: 2, sugars: 1, protein: 3, fat: 4, water: 80,
  carbMeasured: 'available' as const, attribution: 'Invented for a test', licence: 'none',
};

describe('getUsableFoods', () => {
  it('returns table foods to anyone, pack foods to their owner and to the care team of the profile they are shared with', async () => {
    const owner = await signUpUser(ctx.app, 'Owner');
    const carer = await signUpUser(ctx.app, 'Carer');
    const stranger = await signUpUser(ctx.app, 'Stranger');
    const ownerProfileId = owner.me.profiles[0].id;
    await ProfileAccessModel.create({ profileId: ownerProfileId, userId: carer.me.user.id, role: 'carer' });
    const table = await FoodModel.create({ ...base, source: 'ifct2017', sourceCode: 'X001', name: 'Table food', foodGroup: 'Test' });
    const privatePackFood = await FoodModel.create({ ...base, source: 'pack', sourceCode: 'p1', name: 'Private label', foodGroup: null, ownerUserId: owner.me.user.id });
    const sharedPackFood = await FoodModel.create({
      ...base, source: 'pack', sourceCode: 's1', name: 'Shared label', foodGroup: null, ownerUserId: owner.me.user.id, sharedProfileId: ownerProfileId,
    });
    const ids = [table.id, privatePackFood.id, sharedPackFood.id, 999999];

    const forOwner = await getUsableFoods(ids, owner.me.user.id);
    const forCarer = await getUsableFoods(ids, carer.me.user.id);
    const forStranger = await getUsableFoods(ids, stranger.me.user.id);

    expect([...forOwner.keys()].sort()).toEqual([table.id, privatePackFood.id, sharedPackFood.id].sort());
    expect([...forCarer.keys()].sort()).toEqual([table.id, sharedPackFood.id].sort());
    expect([...forStranger.keys()]).toEqual([table.id]);
    expect(forOwner.get(table.id)!.per100g).toEqual({
      energyKcal: 100, energyKj: 418, carbAvailable: 10, carbTotal: 12, fibre: 2, sugars: 1, protein: 3, fat: 4, water: 80,
    });
  });

  it('returns an empty map for no ids', async () => {
    expect((await getUsableFoods([], 1)).size).toBe(0);
  });
});
