import { z } from 'zod';
import { profileIdParamSchema } from '../../shared/schemas/common';
import { planItemParamSchema, planMealCreatedSchema, planMealInputSchema, planSettingsInputSchema, planWeekQuerySchema, plannedCookInputSchema, shoppingTickInputSchema } from '../../shared/schemas/plan';
import { getPlanSettings, savePlanSettings } from '../services/plan-settings.service';
import { getNextPlanMeal, getPlanWeek } from '../services/plan-week.service';
import { createPlanMeal, deletePlanMeal, deletePlannedCook, savePlannedCook, updatePlanMeal } from '../services/plan.service';
import { getShoppingList, setShoppingTick, shoppingListCsv } from '../services/shopping-list.service';
import { loadProfile } from '../services/profiles.service';
import { toLocalTime } from '../../shared/compute/local-time';
import { access, defineRoute, type AnyRoute } from './registry';

const idResponse = z.object({ id: z.number().int() });

async function weekDate(profileId: number, date: string | undefined): Promise<string> {
  return date ?? toLocalTime(Date.now(), (await loadProfile(profileId)).timeZone).localDate;
}

/** The week plan: the week with its numbers, planned meals and cooks, the weekly pattern and meals, the shopping list. */
export function planRoutes(): AnyRoute[] {
  const read = access.profile('plan.read');
  const write = access.profile('plan.write');
  const base = '/profiles/:profileId/plan';
  return [
    defineRoute({
      method: 'get', path: `${base}/week`, access: read, params: profileIdParamSchema, query: planWeekQuerySchema,
      summary: 'The week holding `date` (default today in the profile’s time zone): kinds of day, meals with carbohydrate and planned meal doses, day and week totals, portions used and left, warnings.',
      handler: async ({ params, query }, _req, res) => res.json(await getPlanWeek(params.profileId, query.date, Date.now())),
    }),
    defineRoute({
      method: 'get', path: `${base}/next-meal`, access: read, params: profileIdParamSchema,
      summary: 'The next planned meal not yet logged (today’s first), for the logging flow to offer first.',
      handler: async ({ params }, _req, res) => res.json(await getNextPlanMeal(params.profileId, Date.now())),
    }),
    defineRoute({
      method: 'get', path: `${base}/settings`, access: read, params: profileIdParamSchema, summary: 'Week start, weekly pattern (Monday first) and named meals.',
      handler: async ({ params }, _req, res) => res.json(await getPlanSettings(params.profileId)),
    }),
    defineRoute({
      method: 'put', path: `${base}/settings`, access: write, params: profileIdParamSchema, body: planSettingsInputSchema,
      summary: 'Replace the week start, the weekly pattern and the named meals.',
      handler: async ({ params, body }, _req, res) => res.json(await savePlanSettings(params.profileId, body)),
    }),
    defineRoute({
      method: 'post', path: `${base}/meals`, access: write, params: profileIdParamSchema, body: planMealInputSchema, status: 201, response: planMealCreatedSchema,
      summary: 'Plan a meal on a date (or `repeatDays` days in a row): a portion, a planned cook’s portion, a recipe amount, a pack food or plain carbohydrate.',
      handler: async ({ params, body, user }, _req, res) => res.status(201).json(await createPlanMeal(params.profileId, user.id, body)),
    }),
    defineRoute({
      method: 'put', path: `${base}/meals/:id`, access: write, params: planItemParamSchema, body: planMealInputSchema, response: idResponse,
      summary: 'Replace a planned meal.',
      handler: async ({ params, body, user }, _req, res) => res.json(await updatePlanMeal(params.profileId, params.id, user.id, body)),
    }),
    defineRoute({
      method: 'delete', path: `${base}/meals/:id`, access: write, params: planItemParamSchema, status: 204, summary: 'Take a meal off the plan.',
      handler: async ({ params }, _req, res) => {
        await deletePlanMeal(params.profileId, params.id);
        res.status(204).end();
      },
    }),
    defineRoute({
      method: 'post', path: `${base}/cooks`, access: write, params: profileIdParamSchema, body: plannedCookInputSchema, status: 201, response: idResponse,
      summary: 'Plan a cook: a recipe, a date (or none yet) and a number of portions.',
      handler: async ({ params, body, user }, _req, res) => res.status(201).json(await savePlannedCook(params.profileId, user.id, body)),
    }),
    defineRoute({
      method: 'put', path: `${base}/cooks/:id`, access: write, params: planItemParamSchema, body: plannedCookInputSchema, response: idResponse,
      summary: 'Replace a planned cook.',
      handler: async ({ params, body, user }, _req, res) => res.json(await savePlannedCook(params.profileId, user.id, body, params.id)),
    }),
    defineRoute({
      method: 'delete', path: `${base}/cooks/:id`, access: write, params: planItemParamSchema, status: 204, summary: 'Remove a planned cook and the meals planned from it.',
      handler: async ({ params }, _req, res) => {
        await deletePlannedCook(params.profileId, params.id);
        res.status(204).end();
      },
    }),
    defineRoute({
      method: 'get', path: `${base}/shopping-list`, access: read, params: profileIdParamSchema, query: planWeekQuerySchema,
      summary: 'Grams per food summed over the week’s planned cooks, grouped by food group, with household measures and ticks.',
      handler: async ({ params, query }, _req, res) => res.json(await getShoppingList(params.profileId, await weekDate(params.profileId, query.date))),
    }),
    defineRoute({
      method: 'get', path: `${base}/shopping-list.csv`, access: read, params: profileIdParamSchema, query: planWeekQuerySchema,
      summary: 'The shopping list as CSV (text/csv).',
      handler: async ({ params, query }, _req, res) => {
        const list = await getShoppingList(params.profileId, await weekDate(params.profileId, query.date));
        res.type('text/csv').attachment(`shopping-list-${list.weekStart}.csv`).send(shoppingListCsv(list));
      },
    }),
    defineRoute({
      method: 'put', path: `${base}/shopping-list/ticks`, access: write, params: profileIdParamSchema, body: shoppingTickInputSchema,
      summary: 'Tick a food off the week’s shopping list, or back on.',
      handler: async ({ params, body, user }, _req, res) => res.json(await setShoppingTick(params.profileId, user.id, body)),
    }),
  ];
}
