import { fireEvent, screen, waitFor } from '@testing-library/react';
import { FoodSearchField } from '@/components/foods/food-search-field';
import { fakeApi, renderSignedIn } from './render-with-api';

jest.setTimeout(30_000);

// Invented pack food; the test checks the flow, not a number.
const SAVED = {
  id: 42, name: 'Seed crackers', source: 'pack', sourceCode: 'x', group: null, altNames: [],
  per100g: { energyKcal: null, energyKj: null, carbAvailable: 30, carbTotal: null, fibre: null, sugars: null, protein: null, fat: null, water: null },
  carbMeasured: 'available', carbNote: null, derived: [], attribution: 'a', licence: 'l', ownerUserId: 1, sharedProfileId: null,
  labelConvention: 'eu', hasPhoto: false, scientificName: null, ndbNumber: null, brand: null, branded: false, fibreNotMeasured: false,
  carbStarchSugars: null, measures: [],
};

describe('FoodSearchField when nothing matches', () => {
  it('adds a pack food in place from the typed name and hands it over as the pick', async () => {
    const api = fakeApi({ 'GET /foods': [200, { items: [], nextCursor: null }], 'POST /foods': [201, { food: SAVED }] });
    const onPick = jest.fn();
    renderSignedIn(() => <FoodSearchField label="Add an ingredient" verb="Add" onPick={onPick} />);

    fireEvent.change(screen.getByLabelText('Add an ingredient', { selector: 'input' }), { target: { value: 'Seed crackers' } });
    expect(await screen.findByText('No food matches “Seed crackers”.')).toBeInTheDocument();
    fireEvent.click(screen.getByRole('button', { name: 'Add a pack food' }));
    expect(screen.getByLabelText('Food name', { selector: 'input' })).toHaveValue('Seed crackers');
    fireEvent.change(screen.getByLabelText('Carbohydrate', { selector: 'input' }), { target: { value: '30' } });
    fireEvent.click(screen.getByRole('button', { name: 'Save pack food and use it' }));

    await waitFor(() => expect(onPick).toHaveBeenCalledWith({ id: 42, name: 'Seed crackers', per100g: SAVED.per100g }));
    const sent = api.mock.calls.find(([, init]) => init?.method === 'POST')?.[1]?.body;
    expect(JSON.parse(String(sent))).toMatchObject({ name: 'Seed crackers', carbohydrate: 30, convention: 'eu', basis: 'per100g' });
    expect(await screen.findByLabelText('Add an ingredient', { selector: 'input' })).toHaveValue('');
  });
});
