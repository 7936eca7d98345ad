import path from 'node:path';
import { Router, type NextFunction, type Request, type Response } from 'express';
import multer from 'multer';
import { idParamSchema } from '../../shared/schemas/common';
import { createLabelFoodInputSchema, foodSearchQuerySchema, type FoodSearchQuery } from '../../shared/schemas/food';
import type { Config } from '../config';
import { AppError } from '../errors';
import { requireAuth } from '../middleware/auth';
import { toFieldErrors, validate } from '../middleware/validate';
import { searchFoods } from '../services/food-search.service';
import { getFood, getFoodPhotoPath } from '../services/foods.service';
import { createLabelFood, deleteLabelFood, LABEL_PHOTO_MAX_BYTES } from '../services/label-foods.service';

const upload = multer({ storage: multer.memoryStorage(), limits: { fileSize: LABEL_PHOTO_MAX_BYTES, files: 1 } });

/** Accepts the label photo as multipart (with the form values as JSON in `data`) or a plain JSON body. */
function labelUpload(req: Request, res: Response, next: NextFunction) {
  if (!req.is('multipart/form-data')) return next();
  upload.single('photo')(req, res, (err: unknown) => {
    if (err instanceof multer.MulterError) {
      const message = err.code === 'LIMIT_FILE_SIZE' ? 'The photo is larger than 8 MB.' : 'Send one photo in the field "photo".';
      return next(AppError.validation({ photo: [message] }));
    }
    if (err) return next(err);
    try {
      req.body = JSON.parse(String((req.body as { data?: string }).data ?? '{}'));
    } catch {
      return next(AppError.validation({ data: ['The form values must be JSON.'] }));
    }
    next();
  });
}

/** Food search, food details and label foods. */
export function foodsRouter(config: Config) {
  const router = Router();
  router.use('/foods', requireAuth(config));

  router.get('/foods', validate({ query: foodSearchQuerySchema }), async (req, res) => {
    res.json(await searchFoods(req.query as unknown as FoodSearchQuery, req.auth!.user.id));
  });

  router.get('/foods/:id', validate({ params: idParamSchema }), async (req, res) => {
    res.json({ food: await getFood(Number(req.params.id), req.auth!.user.id) });
  });

  router.get('/foods/:id/photo', validate({ params: idParamSchema }), async (req, res, next) => {
    const stored = await getFoodPhotoPath(Number(req.params.id), req.auth!.user.id);
    res.sendFile(path.resolve(config.UPLOADS_DIR, stored), { headers: { 'Cache-Control': 'private, max-age=3600' } }, (err) => {
      if (err && !res.headersSent) next(AppError.notFound('photo'));
    });
  });

  router.post('/foods', labelUpload, async (req, res) => {
    const parsed = createLabelFoodInputSchema.safeParse(req.body ?? {});
    if (!parsed.success) throw AppError.validation(toFieldErrors(parsed.error));
    const photo = req.file ? { buffer: req.file.buffer, mimetype: req.file.mimetype } : undefined;
    res.status(201).json({ food: await createLabelFood(req.auth!.user.id, parsed.data, config.UPLOADS_DIR, photo) });
  });

  router.delete('/foods/:id', validate({ params: idParamSchema }), async (req, res) => {
    await deleteLabelFood(Number(req.params.id), req.auth!.user.id, config.UPLOADS_DIR);
    res.status(204).end();
  });

  return router;
}
