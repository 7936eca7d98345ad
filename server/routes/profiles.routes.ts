import { Router } from 'express';
import { z } from 'zod';
import {
  dayKindDayInputSchema,
  dayKindDayParamSchema,
  dayKindDaysQuerySchema,
  dayKindIdParamSchema,
  dayKindInputSchema,
  profileSettingsInputSchema,
} from '../../shared/schemas/profile-settings';
import type { Config } from '../config';
import { requireAuth, requireProfileAccess } from '../middleware/auth';
import { validate } from '../middleware/validate';
import { listDayKindDays, setDayKindDay } from '../services/day-kind-days.service';
import {
  createDayKind,
  deleteDayKind,
  getSettings,
  listChanges,
  listDayKinds,
  updateDayKind,
  updateSettings,
} from '../services/profile-settings.service';

const profileParams = z.object({ profileId: z.coerce.number().int().positive('Not a valid id.') });

/** Profile dose settings, day kinds with their ratio blocks, and the change history. */
export function profilesRouter(config: Config) {
  const router = Router();
  const auth = requireAuth(config);
  // Owners, carers and clinicians with access may both read and edit (per the profile issue).
  const access = requireProfileAccess(['owner', 'carer', 'clinician']);
  const base = '/profiles/:profileId';

  router.get(`${base}/settings`, auth, access, validate({ params: profileParams }), async (req, res) => {
    res.json(await getSettings(Number(req.params.profileId)));
  });
  router.put(`${base}/settings`, auth, access, validate({ params: profileParams, body: profileSettingsInputSchema }), async (req, res) => {
    res.json(await updateSettings(Number(req.params.profileId), req.auth!.user.id, req.body));
  });
  router.get(`${base}/settings/history`, auth, access, validate({ params: profileParams }), async (req, res) => {
    res.json({ changes: await listChanges(Number(req.params.profileId)) });
  });
  router.get(`${base}/day-kinds`, auth, access, validate({ params: profileParams }), async (req, res) => {
    res.json({ dayKinds: await listDayKinds(Number(req.params.profileId)) });
  });
  router.post(`${base}/day-kinds`, auth, access, validate({ params: profileParams, body: dayKindInputSchema }), async (req, res) => {
    res.status(201).json(await createDayKind(Number(req.params.profileId), req.auth!.user.id, req.body));
  });
  router.put(`${base}/day-kinds/:dayKindId`, auth, access, validate({ params: dayKindIdParamSchema, body: dayKindInputSchema }), async (req, res) => {
    const { profileId, dayKindId } = req.params as unknown as z.infer<typeof dayKindIdParamSchema>;
    res.json(await updateDayKind(profileId, dayKindId, req.auth!.user.id, req.body));
  });
  router.delete(`${base}/day-kinds/:dayKindId`, auth, access, validate({ params: dayKindIdParamSchema }), async (req, res) => {
    const { profileId, dayKindId } = req.params as unknown as z.infer<typeof dayKindIdParamSchema>;
    await deleteDayKind(profileId, dayKindId, req.auth!.user.id);
    res.status(204).end();
  });
  router.get(`${base}/days`, auth, access, validate({ params: profileParams, query: dayKindDaysQuerySchema }), async (req, res) => {
    const { from, to } = req.query as unknown as z.infer<typeof dayKindDaysQuerySchema>;
    res.json({ days: await listDayKindDays(Number(req.params.profileId), from, to) });
  });
  router.put(`${base}/days/:date`, auth, access, validate({ params: dayKindDayParamSchema, body: dayKindDayInputSchema }), async (req, res) => {
    const { profileId, date } = req.params as unknown as z.infer<typeof dayKindDayParamSchema>;
    res.json(await setDayKindDay(profileId, date, req.auth!.user.id, req.body));
  });
  return router;
}
