import { fireEvent, screen, waitFor, within } from '@testing-library/react';
import { FoodDetailScreen } from '@/components/foods/food-detail-screen';
import type { Food } from '@/shared/schemas/food';
import { expectErrorUnder, fakeApi, fieldErrors, renderSignedIn } from './render-with-api';

jest.setTimeout(30_000);

// An invented pack food of the signed-in person (user 1): these tests check where messages land, not numbers.
const PACK: Food = {
  id: 5, name: 'Oat crackers (Hillside)', source: 'pack', sourceCode: 'x', group: null, altNames: ['Hillside'],
  per100g: { energyKcal: 371, energyKj: 1552, carbAvailable: 60, carbTotal: 70, fibre: 10, sugars: 2, protein: 12, fat: 7, water: null },
  carbMeasured: 'available', carbNote: null, derived: ['carbTotal', 'energyKj'], attribution: 'Typed from a package label.', licence: 'Private.',
  ownerUserId: 1, sharedProfileId: null, labelConvention: 'eu', hasPhoto: false, scientificName: null, ndbNumber: null, brand: 'Hillside',
  branded: false, fibreNotMeasured: false, carbStarchSugars: null, measures: [],
};

const press = (name: string) => fireEvent.click(screen.getByRole('button', { name }));

describe('your pack food on its page', () => {
  it('opens the edit form with the stored values and puts a server field error under its field', async () => {
    const api = fakeApi({ 'GET /foods/5': [200, { food: PACK }], 'PUT /foods/5': fieldErrors({ carbohydrate: ['Carbohydrate is too large.'] }) });
    renderSignedIn(() => <FoodDetailScreen id={5} />);

    fireEvent.click(await screen.findByRole('button', { name: 'Edit pack food' }));
    expect(screen.getByLabelText('Food name', { selector: 'input' })).toHaveValue('Oat crackers');
    expect(screen.getByLabelText('Brand (optional)', { selector: 'input' })).toHaveValue('Hillside');
    press('Save pack food');

    await expectErrorUnder('Carbohydrate', 'Carbohydrate is too large.');
    const sent = api.mock.calls.find(([, init]) => init?.method === 'PUT')?.[1]?.body;
    expect(JSON.parse(String(sent))).toMatchObject({ name: 'Oat crackers', brand: 'Hillside', basis: 'per100g', convention: 'eu', carbohydrate: 60, fibre: 10 });
  });

  it('lists the recipes that still use it when the delete is refused', async () => {
    fakeApi({
      'GET /foods/5': [200, { food: PACK }],
      'DELETE /foods/5': [409, { error: { code: 'conflict', message: 'Used.', fieldErrors: { recipes: ['Cracker crumble', 'Overnight oats'] } } }],
    });
    renderSignedIn(() => <FoodDetailScreen id={5} />);

    fireEvent.click(await screen.findByRole('button', { name: 'Delete pack food' }));
    press('Yes, delete it');

    const list = await screen.findByRole('list', { name: 'Recipes that use this pack food' });
    await waitFor(() => expect(within(list).getAllByRole('listitem').map((li) => li.textContent)).toEqual(['• Cracker crumble', '• Overnight oats']));
  });

  it('offers no edit or delete on a table food', async () => {
    fakeApi({ 'GET /foods/5': [200, { food: { ...PACK, source: 'usda_sr28', ownerUserId: null } }] });
    renderSignedIn(() => <FoodDetailScreen id={5} />);

    expect(await screen.findByText('Household measures')).toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Edit pack food' })).toBeNull();
    expect(screen.queryByRole('button', { name: 'Delete pack food' })).toBeNull();
  });
});
