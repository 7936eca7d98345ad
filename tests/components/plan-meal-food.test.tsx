import { fireEvent, screen, waitFor } from '@testing-library/react';
import { PlanMealScreen } from '@/components/plan/plan-meal-screen';
import { fakeApi, fieldErrors, renderSignedIn, type Routes } from './render-with-api';

// Rendering whole screens is slow on a shared machine; no timing is asserted.
jest.setTimeout(30_000);

// Invented food and plan: the tests check what the form sends, not any arithmetic.
const RICE = {
  id: 42, name: 'Rice, white, cooked', source: 'usda_sr28', sourceCode: '20045', group: 'Cereal Grains and Pasta', altNames: [],
  per100g: { energyKcal: null, energyKj: null, carbAvailable: 28, carbTotal: 28.4, fibre: 0.4, sugars: null, protein: null, fat: null, water: null },
  carbMeasured: 'total', carbNote: null, derived: [], attribution: 'a', licence: 'l', ownerUserId: null, sharedProfileId: null,
  labelConvention: null, hasPhoto: false, scientificName: null, ndbNumber: '20045', brand: null, branded: false, fibreNotMeasured: false,
  carbStarchSugars: null, measures: [],
};
const WEEK = { weekStart: '2026-03-09', today: '2026-03-09', timeZone: 'UTC', basis: 'available', unit: 'g', doseReady: true, days: [], cooks: [], use: [], totals: {}, warnings: [] };

function planApi(extra: Routes = {}) {
  return fakeApi({
    'GET /profiles/1/plan/settings': [200, { weekStart: 1, pattern: [], mealNames: [{ id: 3, name: 'Lunch', time: '12:30' }] }],
    'GET /profiles/1/plan/week': [200, WEEK],
    'GET /profiles/1/batches': [200, { items: [] }],
    'GET /recipes': [200, { items: [] }],
    'GET /foods': [200, { items: [RICE], nextCursor: null }],
    ...extra,
  });
}

const posted = (api: ReturnType<typeof fakeApi>) => api.mock.calls.filter(([, init]) => init?.method === 'POST').map(([, init]) => JSON.parse(String(init!.body)));

async function pickRice() {
  fireEvent.click(await screen.findByRole('radio', { name: 'A food by grams (a pack food or one from the tables)' }));
  fireEvent.change(screen.getByLabelText('Food', { selector: 'input' }), { target: { value: 'rice' } });
  fireEvent.click(await screen.findByRole('button', { name: 'Plan Rice, white, cooked' }));
  expect(await screen.findByText('28 g carbohydrate per 100 g')).toBeInTheDocument();
}

describe('plan a meal: a food by grams', () => {
  it('picks a food with the food search and sends its id and grams', async () => {
    const api = planApi({ 'POST /profiles/1/plan/meals': [201, { ids: [9] }] });
    renderSignedIn(() => <PlanMealScreen date="2026-03-11" />);

    await pickRice();
    fireEvent.change(screen.getByLabelText('Grams', { selector: 'input' }), { target: { value: '180' } });
    fireEvent.click(screen.getByRole('button', { name: 'Plan this meal' }));

    await waitFor(() => expect(posted(api)).toHaveLength(1));
    expect(posted(api)[0]).toMatchObject({ date: '2026-03-11', mealNameId: 3, source: 'food', foodId: 42, grams: 180, repeatDays: 1 });
  });

  it('asks for a food before sending, and shows the server’s answer about it under the search', async () => {
    const api = planApi({ 'POST /profiles/1/plan/meals': fieldErrors({ foodId: ['That food was not found.'] }) });
    renderSignedIn(() => <PlanMealScreen date="2026-03-11" />);

    fireEvent.click(await screen.findByRole('radio', { name: 'A food by grams (a pack food or one from the tables)' }));
    fireEvent.change(screen.getByLabelText('Grams', { selector: 'input' }), { target: { value: '180' } });
    fireEvent.click(screen.getByRole('button', { name: 'Plan this meal' }));
    expect(await screen.findByText('Pick a food.')).toBeInTheDocument();
    expect(posted(api)).toHaveLength(0);

    await pickRice();
    fireEvent.click(screen.getByRole('button', { name: 'Plan this meal' }));
    expect(await screen.findByText('That food was not found.')).toBeInTheDocument();
    expect(posted(api)).toHaveLength(1);
  });
});
