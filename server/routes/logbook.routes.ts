import { z } from 'zod';
import { profileIdParamSchema, profileItemParamSchema } from '../../shared/schemas/common';
import {
  createLogEntryInputSchema,
  editLogEntryInputSchema,
  logEntryChangeSchema,
  logEntrySchema,
  logGroupSchema,
  logMealInputSchema,
  recentLogQuerySchema,
} from '../../shared/schemas/logbook';
import { deleteLogEntry, editLogEntry, listEntryChanges, undoLogGroup } from '../services/log-corrections.service';
import { createLogEntry, listRecentEntries, logMeal } from '../services/log-entries.service';
import { access, defineRoute, type AnyRoute } from './registry';

const groupParamSchema = profileIdParamSchema.extend({ groupKey: z.uuid('Not a valid group.') });

/** The logbook's entries: log a meal (one transaction), one entry of any kind, recent entries, corrections, undo. */
export function logbookRoutes(): AnyRoute[] {
  const base = '/profiles/:profileId/log-entries';
  const read = access.profile('log.read');
  const write = access.profile('log.write');
  return [
    defineRoute({
      method: 'post', path: `${base}/meals`, access: write, params: profileIdParamSchema, body: logMealInputSchema, response: logGroupSchema,
      summary: 'Log a meal in one transaction: the meal, an optional reading, the doses taken with the suggestion shown and the portion eaten; 409 when the portion is already eaten (nothing written).',
      handler: async ({ params, user, body }, _req, res) => res.status(201).json(await logMeal(params.profileId, user.id, body)),
    }),
    defineRoute({
      method: 'post', path: base, access: write, params: profileIdParamSchema, body: createLogEntryInputSchema, response: logGroupSchema,
      summary: 'Log one entry: a meal, a glucose reading, a rapid- or long-acting dose, or exercise.',
      handler: async ({ params, user, body }, _req, res) => res.status(201).json(await createLogEntry(params.profileId, user.id, body)),
    }),
    defineRoute({
      method: 'get', path: `${base}/recent`, access: read, params: profileIdParamSchema, query: recentLogQuerySchema, response: z.array(logEntrySchema),
      summary: 'The most recent entries (not deleted), newest first.',
      handler: async ({ params, query }, _req, res) => res.json(await listRecentEntries(params.profileId, query)),
    }),
    defineRoute({
      method: 'patch', path: `${base}/:id`, access: write, params: profileItemParamSchema, body: editLogEntryInputSchema, response: logEntrySchema,
      summary: 'Correct an entry; the version before is kept in its changes.',
      handler: async ({ params, user, body }, _req, res) => res.json(await editLogEntry(params.profileId, params.id, user.id, body)),
    }),
    defineRoute({
      method: 'delete', path: `${base}/:id`, access: write, params: profileItemParamSchema, response: logEntrySchema,
      summary: 'Delete an entry (kept as deleted, with its history); a logged portion goes back to not eaten yet.',
      handler: async ({ params, user }, _req, res) => res.json(await deleteLogEntry(params.profileId, params.id, user.id)),
    }),
    defineRoute({
      method: 'get', path: `${base}/:id/changes`, access: read, params: profileItemParamSchema, response: z.array(logEntryChangeSchema),
      summary: "An entry's corrections, oldest first: who, when, before and after.",
      handler: async ({ params }, _req, res) => res.json(await listEntryChanges(params.profileId, params.id)),
    }),
    defineRoute({
      method: 'post', path: '/profiles/:profileId/log-groups/:groupKey/undo', access: write, params: groupParamSchema, response: logGroupSchema,
      summary: 'Undo a save: reverts every entry saved together (meal, reading, doses) and the portion eaten state.',
      handler: async ({ params, user }, _req, res) => res.json(await undoLogGroup(params.profileId, params.groupKey, user.id)),
    }),
  ];
}
