import { cookFieldOf, stepOfField, toCreateBatchRequest } from '@/components/kitchen/batch-request';
import { toContainerRequest } from '@/components/kitchen/containers-panel';
import { cookFormDefaults, type CookFormValues } from '@/components/kitchen/cook-state';
import { doseFormDefaults, toDoseRequest, type DoseFormValues } from '@/components/dose/dose-request';
import { recipeFieldOf, recipeFormValues, toRecipeRequest, type RecipeFormValues } from '@/components/recipes/recipe-request';
import { toPackFoodRequest, emptyPackFood } from '@/components/foods/pack-food-form-values';
import { emptyNutrients } from '@/shared/compute/nutrients';
import { createBatchInputSchema } from '@/shared/schemas/batch';
import { doseRequestSchema } from '@/shared/schemas/dose';
import type { RecipeDetail } from '@/shared/schemas/recipe';

// Every value below is invented for the test; the builders only move and convert what was typed.
const NOW = Date.UTC(2026, 2, 1, 12, 0);
const CTX = { now: NOW, glucoseUnit: 'mmol_l' as const, date: '2026-03-01' };
const minutesBefore = (m: number) => new Date(NOW - m * 60_000).toISOString();
const dose = (patch: Partial<DoseFormValues>): DoseFormValues => ({ ...doseFormDefaults('40', new Date(NOW)), localTime: '12:00', ...patch });

describe('toDoseRequest', () => {
  it.each([
    { name: 'no reading: no time, no correction', values: dose({}), expected: { glucose: null, glucoseTakenAt: null, exercise: null, split: null } },
    { name: 'a reading 10 minutes ago', values: dose({ glucose: '6,5', glucoseMinutesAgo: '10' }), expected: { glucose: '6,5', glucoseTakenAt: minutesBefore(10) } },
    {
      name: 'exercise and a two-part dose',
      values: dose({ exerciseIntensity: 'light', exerciseDuration: '30', exerciseStartsIn: '90', splitOn: true, splitNow: '70', splitLater: '120' }),
      expected: { exercise: { intensity: 'light', durationMinutes: '30', startsInMinutes: '90' }, split: { nowPercent: '70', laterMinutes: '120' } },
    },
    {
      name: 'earlier doses, empty rows skipped',
      values: dose({ earlierDoses: [{ units: '', minutesAgo: '' }, { units: '2', minutesAgo: '45' }] }),
      expected: { earlierDoses: [{ units: '2', takenAt: minutesBefore(45) }] },
    },
  ])('$name', ({ values, expected }) => {
    const { request, errors } = toDoseRequest(values, CTX);
    expect(errors).toEqual({});
    expect(request).toMatchObject({ carbsGrams: '40', mealAt: new Date(NOW).toISOString(), date: '2026-03-01', glucoseUnit: 'mmol_l', ...expected });
    expect(doseRequestSchema.safeParse(request).success).toBe(true);
  });

  it.each([
    { name: 'a reading without its time', values: dose({ glucose: '6' }), path: 'glucoseTakenAt', field: 'glucoseMinutesAgo' },
    { name: 'a reading time in words', values: dose({ glucose: '6', glucoseMinutesAgo: 'soon' }), path: 'glucoseTakenAt', field: 'glucoseMinutesAgo' },
    { name: 'an earlier dose without its time', values: dose({ earlierDoses: [{ units: '1', minutesAgo: '' }] }), path: 'earlierDoses.0.minutesAgo', field: 'earlierDoses.0.minutesAgo' },
  ])('refuses $name under its field', ({ values, path, field }) => {
    const { errors, fieldOf } = toDoseRequest(values, CTX);
    expect(Object.keys(errors)).toEqual([path]);
    expect(fieldOf(path)).toBe(field);
  });

  it('starts with an empty reading time (no claim of a fresh reading) and rounds a linked carbohydrate to 0.1 g', () => {
    expect(doseFormDefaults('28.83', new Date(NOW))).toMatchObject({ glucoseMinutesAgo: '', carbsGrams: '28.8' });
  });
});

const RECIPE = {
  id: 5,
  title: 'Porridge',
  description: '',
  tags: [],
  methodSteps: [],
  visibility: 'private',
  defaultPortions: 4,
  ingredients: [{ foodId: 7, grams: 100, food: { id: 7, name: 'Oats', per100g: emptyNutrients(), measures: [] }, measureLabel: null, note: null }],
} as unknown as RecipeDetail;

describe('toCreateBatchRequest', () => {
  const base = (patch: Partial<CookFormValues>): CookFormValues => ({ ...cookFormDefaults(RECIPE, '2026-03-01', 'uk'), ...patch });
  const weighedLine = { ...base({}).lines[0], reading: '98,5' };

  it.each([
    {
      name: 'weighed portions, a saved container, decimal commas',
      values: base({ lines: [weighedLine], pot: { containerId: '3', tare: '1200', gross: '1650' }, portions: [{ containerId: '', tare: '', gross: '210' }] }),
      expected: {
        ingredients: [{ foodId: 7, plannedGrams: 100, actualGrams: 98.5, omitted: false, swappedFromFoodId: null }],
        cookedWeight: { containerId: 3, grossGrams: 1650, tareGrams: 1200 },
        split: { mode: 'weighed', portions: [{ containerId: null, grossGrams: 210, tareGrams: 0 }] },
      },
    },
    {
      name: 'equal portions, an ingredient left out and another swapped',
      values: base({
        splitMode: 'equal',
        count: '3',
        lines: [
          { ...weighedLine, foodId: 9, swappedFrom: { foodId: 7, foodName: 'Oats' } },
          { ...weighedLine, foodId: 8, reading: '', omitted: true },
        ],
        pot: { containerId: '', tare: '0', gross: '500' },
      }),
      expected: {
        ingredients: [
          { foodId: 9, plannedGrams: 100, actualGrams: 98.5, omitted: false, swappedFromFoodId: 7 },
          { foodId: 8, plannedGrams: 100, actualGrams: null, omitted: true, swappedFromFoodId: null },
        ],
        split: { mode: 'equal', count: 3 },
      },
    },
  ])('$name', ({ values, expected }) => {
    const request = toCreateBatchRequest(values);
    expect(request).toMatchObject({ recipeId: 5, scaleFactor: 1, cookedOn: '2026-03-01', storage: 'fridge', region: 'uk', ...expected });
    expect(createBatchInputSchema.safeParse(request).success).toBe(true);
  });

  it.each([
    { path: 'ingredients.2.actualGrams', field: 'lines.2.reading', step: 'weigh' },
    { path: 'ingredients', field: 'lines', step: 'weigh' },
    { path: 'cookedWeight.tareGrams', field: 'pot.tare', step: 'cooked' },
    { path: 'split.portions.1.grossGrams', field: 'portions.1.gross', step: 'split' },
    { path: 'split.portions', field: 'portions', step: 'split' },
    { path: 'split.count', field: 'count', step: 'split' },
    { path: 'useBy', field: 'useBy', step: 'store' },
  ])('puts $path under $field on the $step step', ({ path, field, step }) => {
    expect(cookFieldOf(path)).toBe(field);
    expect(stepOfField(field)).toBe(step);
  });
});

describe('toRecipeRequest', () => {
  const values: RecipeFormValues = {
    ...recipeFormValues(),
    title: 'Porridge',
    portions: '2',
    tags: ' breakfast, , quick ',
    steps: 'Soak.\n\n Simmer. ',
    ingredients: [{ ...recipeFormValues(RECIPE).ingredients[0], grams: '80,5', measureLabel: '1 cup', note: '' }],
  };

  it('splits tags and steps, reads grams and leaves empty extras out', () => {
    expect(toRecipeRequest(values)).toEqual({
      title: 'Porridge',
      description: '',
      defaultPortions: 2,
      tags: ['breakfast', 'quick'],
      methodSteps: ['Soak.', 'Simmer.'],
      visibility: 'private',
      ingredients: [{ foodId: 7, grams: 80.5, measureLabel: '1 cup', note: null }],
    });
  });

  it.each([
    { path: 'defaultPortions', field: 'portions' },
    { path: 'methodSteps.3', field: 'steps' },
    { path: 'tags.0', field: 'tags' },
    { path: 'ingredients.1.grams', field: 'ingredients.1.grams' },
    { path: 'ingredients', field: 'ingredients' },
    { path: 'title', field: 'title' },
    { path: 'ownerId', field: undefined },
  ])('puts $path under $field', ({ path, field }) => {
    expect(recipeFieldOf(path)).toBe(field);
  });
});

describe('small request builders', () => {
  it.each([
    { name: 'container: a blank empty weight is missing, not 0 g', got: toContainerRequest({ name: 'Jar', kind: 'container', tareGrams: ' ' }), expected: { name: 'Jar', kind: 'container', tareGrams: undefined } },
    { name: 'container: a typed empty weight is kept for the schema', got: toContainerRequest({ name: 'Pot', kind: 'pot', tareGrams: '1450' }), expected: { name: 'Pot', kind: 'pot', tareGrams: '1450' } },
    {
      name: 'pack food: shared with another profile',
      got: toPackFoodRequest({ ...emptyPackFood, name: 'Crackers', carbohydrate: '61,2', share: '12' }),
      expected: { name: 'Crackers', carbohydrate: 61.2, fibre: null, servingGrams: null, sharedProfileId: 12 },
    },
  ])('$name', ({ got, expected }) => {
    expect(got).toMatchObject(expected);
  });
});
