import { profileIdParamSchema } from '../../shared/schemas/common';
import {
  dayKindDayInputSchema,
  dayKindDayParamSchema,
  dayKindDaysQuerySchema,
  dayKindIdParamSchema,
  dayKindInputSchema,
  profileSettingsInputSchema,
} from '../../shared/schemas/profile-settings';
import { listDayKindDays, setDayKindDay } from '../services/day-kind-days.service';
import { createDayKind, deleteDayKind, listDayKinds, updateDayKind } from '../services/day-kinds.service';
import { getSettings, updateSettings } from '../services/profile-settings.service';
import { listChanges } from '../services/settings-history.service';
import { access, defineRoute, type AnyRoute } from './registry';

/** Profile dose settings, day kinds with their times of day, and the change history. */
export function profilesRoutes(): AnyRoute[] {
  const read = access.profile('profile.read');
  const settings = access.profile('settings.write');
  const ratios = access.profile('ratios.write');
  const base = '/profiles/:profileId';
  const params = profileIdParamSchema;
  return [
    defineRoute({
      method: 'get', path: `${base}/settings`, access: read, params, summary: 'Units and safety limits (`settings: null` until set up).',
      handler: async ({ params: p }, _req, res) => res.json(await getSettings(p.profileId)),
    }),
    defineRoute({
      method: 'put', path: `${base}/settings`, access: settings, params, body: profileSettingsInputSchema,
      summary: 'Save units and safety limits (glucose values in the body\'s `glucoseUnit`); the change is recorded.',
      handler: async ({ params: p, user, body }, _req, res) => res.json(await updateSettings(p.profileId, user.id, body)),
    }),
    defineRoute({
      method: 'get', path: `${base}/settings/history`, access: read, params, summary: 'Every change, newest first: who, when, field by field old → new.',
      handler: async ({ params: p }, _req, res) => res.json({ changes: await listChanges(p.profileId) }),
    }),
    defineRoute({
      method: 'get', path: `${base}/day-kinds`, access: read, params, summary: 'Day kinds with their times of day, default first.',
      handler: async ({ params: p }, _req, res) => res.json({ dayKinds: await listDayKinds(p.profileId) }),
    }),
    defineRoute({
      method: 'post', path: `${base}/day-kinds`, access: ratios, params, body: dayKindInputSchema, status: 201,
      summary: 'Create a day kind: times of day cover 00:00–24:00 without gaps or overlaps; the first becomes the default.',
      handler: async ({ params: p, user, body }, _req, res) => res.status(201).json(await createDayKind(p.profileId, user.id, body)),
    }),
    defineRoute({
      method: 'put', path: `${base}/day-kinds/:dayKindId`, access: ratios, params: dayKindIdParamSchema, body: dayKindInputSchema,
      summary: 'Replace a day kind.',
      handler: async ({ params: p, user, body }, _req, res) => res.json(await updateDayKind(p.profileId, p.dayKindId, user.id, body)),
    }),
    defineRoute({
      method: 'delete', path: `${base}/day-kinds/:dayKindId`, access: ratios, params: dayKindIdParamSchema, status: 204,
      summary: 'Delete a day kind (the default only when it is the last one).',
      handler: async ({ params: p, user }, _req, res) => {
        await deleteDayKind(p.profileId, p.dayKindId, user.id);
        res.status(204).end();
      },
    }),
    defineRoute({
      method: 'get', path: `${base}/days`, access: read, params, query: dayKindDaysQuerySchema, summary: 'The day kind in force on each date (at most 62 days).',
      handler: async ({ params: p, query }, _req, res) => res.json({ days: await listDayKindDays(p.profileId, query.from, query.to) }),
    }),
    defineRoute({
      method: 'put', path: `${base}/days/:date`, access: ratios, params: dayKindDayParamSchema, body: dayKindDayInputSchema,
      summary: 'Give a date another day kind (null: back to the default).',
      handler: async ({ params: p, user, body }, _req, res) => res.json(await setDayKindDay(p.profileId, p.date, user.id, body)),
    }),
  ];
}
