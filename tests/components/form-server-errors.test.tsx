import { fireEvent, screen, waitFor } from '@testing-library/react';
import { DoseCheckScreen } from '@/components/dose/dose-check-screen';
import { ContainersPanel } from '@/components/kitchen/containers-panel';
import { CookBatchScreen } from '@/components/kitchen/cook-batch-screen';
import { RecipeEditorScreen } from '@/components/recipes/recipe-editor-screen';
import { SharePanel } from '@/components/recipes/share-panel';
import { emptyNutrients } from '@/shared/compute/nutrients';
import type { RecipeDetail } from '@/shared/schemas/recipe';
import { expectErrorUnder, fakeApi, fieldErrors, renderSignedIn } from './render-with-api';

// Rendering whole screens is slow on a shared machine; no timing is asserted.
jest.setTimeout(30_000);

// Invented foods and weights: these tests check where a message lands, not any number.
const OATS = { id: 7, name: 'Oats, rolled', per100g: { ...emptyNutrients(), carbAvailable: 60, carbTotal: 70 } };

const type = (label: string, value: string) => fireEvent.change(screen.getByLabelText(label, { selector: 'input, textarea' }), { target: { value } });
const press = (name: string) => fireEvent.click(screen.getByRole('button', { name }));

describe('a server field error lands under its field', () => {
  it('share panel: the email', async () => {
    fakeApi({ 'POST /recipes/3/shares': fieldErrors({ email: ['That person already has this recipe.'] }) });
    renderSignedIn(() => <SharePanel recipeId={3} shares={[]} />);

    type('Their email address', 'sam@example.test');
    press('Offer');

    await expectErrorUnder('Their email address', 'That person already has this recipe.');
  });

  it('containers panel: the name', async () => {
    const api = fakeApi({ 'GET /profiles/1/containers': [200, { items: [] }], 'POST /profiles/1/containers': fieldErrors({ name: ['You already have a container with that name.'] }) });
    renderSignedIn(() => <ContainersPanel profileId={1} />);

    type('Name', 'Blue jar');
    type('Empty weight', '212');
    press('Save container');

    await expectErrorUnder('Name', 'You already have a container with that name.');
    const sent = api.mock.calls.find(([, init]) => init?.method === 'POST')?.[1]?.body;
    expect(JSON.parse(String(sent))).toEqual({ name: 'Blue jar', kind: 'container', tareGrams: 212 });
  });

  it('recipe editor: portions (defaultPortions in the request) and an ingredient’s grams', async () => {
    fakeApi({
      'GET /foods': [200, { items: [{ ...OATS, attribution: 'Test table', source: 'usda_sr28' }], nextCursor: null }],
      'GET /foods/7': [200, { food: { ...OATS, measures: [] } }],
      'POST /recipes': fieldErrors({ defaultPortions: ['At most 100 portions.'], 'ingredients.0.grams': ['At most 20000 g per ingredient.'] }),
    });
    renderSignedIn(() => <RecipeEditorScreen />);

    type('Title', 'Porridge');
    type('Add an ingredient', 'oats');
    fireEvent.click(await screen.findByRole('button', { name: 'Add Oats, rolled' }));
    type('Grams of Oats, rolled', '80');
    press('Save recipe');

    await expectErrorUnder('Portions', 'At most 100 portions.');
    await expectErrorUnder('Grams of Oats, rolled', 'At most 20000 g per ingredient.');
  });

  it('recipe editor: an error on a detail field opens the compact row’s details and lands under the note', async () => {
    fakeApi({
      'GET /foods': [200, { items: [{ ...OATS, attribution: 'Test table', source: 'usda_sr28' }], nextCursor: null }],
      'GET /foods/7': [200, { food: { ...OATS, measures: [] } }],
      'POST /recipes': fieldErrors({ 'ingredients.0.note': ['Keep the note under 200 characters.'] }),
    });
    renderSignedIn(() => <RecipeEditorScreen />);

    type('Title', 'Porridge');
    type('Add an ingredient', 'oats');
    fireEvent.click(await screen.findByRole('button', { name: 'Add Oats, rolled' }));
    type('Grams of Oats, rolled', '80');
    // Compact: the details are closed until asked for.
    expect(screen.queryByLabelText('Note (optional)', { selector: 'input, textarea' })).toBeNull();
    press('Save recipe');

    await expectErrorUnder('Note (optional)', 'Keep the note under 200 characters.');
    expect(screen.getByRole('button', { name: 'Hide details for Oats, rolled' })).toBeInTheDocument();
  });

  it('dose check: the reading time (glucoseTakenAt in the request)', async () => {
    fakeApi({
      'GET /profiles/1/settings': [200, { glucoseUnit: 'mmol_l', carbBasis: 'available', carbUnit: 'g', settings: { penIncrement: 0.5 }, updatedAt: null }],
      'GET /profiles/1/day-kinds': [200, { dayKinds: [{ id: 4, name: 'Rest', isDefault: true, longActingUnits: null, glucoseUnit: 'mmol_l', timesOfDay: [], updatedAt: '' }] }],
      'GET /profiles/1/days': [200, { days: [] }],
      'POST /profiles/1/dose-suggestions': fieldErrors({ glucoseTakenAt: ['The reading is older than the meal by more than a day.'] }),
    });
    renderSignedIn(() => <DoseCheckScreen />);

    await screen.findByLabelText('Carbohydrate (available)');
    type('Carbohydrate (available)', '40');
    type('Glucose now', '6');
    type('Reading taken', '5');
    press('Check a dose');

    await expectErrorUnder('Reading taken', 'The reading is older than the meal by more than a day.');
  });

  it('cook screen: the pot’s gross weight, after going back to that step', async () => {
    const recipe = {
      id: 5,
      title: 'Porridge pot',
      defaultPortions: 2,
      ingredients: [{ id: 1, position: 0, foodId: OATS.id, grams: 100, measureLabel: null, note: null, food: OATS }],
    } as unknown as RecipeDetail;
    fakeApi({
      'GET /recipes/5': [200, recipe],
      'GET /profiles/1/containers': [200, { items: [] }],
      'POST /profiles/1/batches': fieldErrors({ 'cookedWeight.grossGrams': ['More than the scale can read.'] }),
    });
    renderSignedIn(() => <CookBatchScreen recipeId={5} />);

    fireEvent.change(await screen.findByLabelText('Scale reading', { selector: 'input' }), { target: { value: '100' } });
    press('All weighed: weigh the pot');
    type('Empty pot (tare)', '500');
    type('Pot with the food (gross)', '900');
    press('Portion out');
    type('Full container 1 (gross)', '400');
    press('Storage and use-by');
    press('Save batch and portions');

    await expectErrorUnder('Pot with the food (gross)', 'More than the scale can read.');
    expect(screen.getByRole('tab', { selected: true })).toHaveTextContent('2 Pot');
  });
});

describe('the dose check before anything is worked out', () => {
  it('shows the caution, leaves the reading time empty and asks for it once a reading is typed', async () => {
    const api = fakeApi({
      'GET /profiles/1/settings': [200, { glucoseUnit: 'mmol_l', carbBasis: 'available', carbUnit: 'g', settings: { penIncrement: 0.5 }, updatedAt: null }],
      'GET /profiles/1/day-kinds': [200, { dayKinds: [{ id: 4, name: 'Rest', isDefault: true, longActingUnits: null, glucoseUnit: 'mmol_l', timesOfDay: [], updatedAt: '' }] }],
      'GET /profiles/1/days': [200, { days: [] }],
    });
    renderSignedIn(() => <DoseCheckScreen />);

    expect(await screen.findByText(/A calculation, not medical advice/)).toBeInTheDocument();
    expect(screen.getByLabelText('Reading taken', { selector: 'input' })).toHaveValue('');
    type('Carbohydrate (available)', '40');
    type('Glucose now', '6');
    press('Check a dose');

    await expectErrorUnder('Reading taken', 'Enter how many minutes ago the reading was taken (0 or more).');
    await waitFor(() => expect(api.mock.calls.some(([, init]) => init?.method === 'POST')).toBe(false));
  });

  it('logging a meal: the reading time stays empty until a reading is typed, then says "now" (0 minutes ago)', async () => {
    fakeApi({
      'GET /profiles/1/settings': [200, { glucoseUnit: 'mmol_l', carbBasis: 'available', carbUnit: 'g', settings: { penIncrement: 0.5 }, updatedAt: null }],
      'GET /profiles/1/day-kinds': [200, { dayKinds: [{ id: 4, name: 'Rest', isDefault: true, longActingUnits: null, glucoseUnit: 'mmol_l', timesOfDay: [], updatedAt: '' }] }],
      'GET /profiles/1/days': [200, { days: [] }],
    });
    renderSignedIn(() => <DoseCheckScreen log="1" />);

    const taken = await screen.findByLabelText('Reading taken', { selector: 'input' });
    expect(taken).toHaveValue('');
    type('Glucose now', '6.4');
    await waitFor(() => expect(taken).toHaveValue('0'));
  });
});
