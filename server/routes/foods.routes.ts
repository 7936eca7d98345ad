import type { NextFunction, Request, Response } from 'express';
import multer from 'multer';
import { z } from 'zod';
import { idParamSchema } from '../../shared/schemas/common';
import { createPackFoodInputSchema, foodSchema, foodSearchPageSchema, foodSearchQuerySchema } from '../../shared/schemas/food';
import { AppError } from '../errors';
import { searchFoods } from '../services/food-search.service';
import { getFood, getFoodPhotoPath } from '../services/foods.service';
import { createPackFood, deletePackFood, PACK_PHOTO_MAX_BYTES, updatePackFood } from '../services/pack-foods.service';
import { signedPhotoUrl } from '../services/photos.service';
import { access, defineRoute, type AnyRoute, type AppDeps } from './registry';

const upload = multer({ storage: multer.memoryStorage(), limits: { fileSize: PACK_PHOTO_MAX_BYTES, files: 1 } });

/** Accepts the label photo as multipart (with the form values as JSON in `data`) or a plain JSON body. */
function packPhotoUpload(req: Request, res: Response, next: NextFunction) {
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

const foodBody = z.object({ food: foodSchema });

/** Food search, food details and pack foods. */
export function foodsRoutes(deps: AppDeps): AnyRoute[] {
  return [
    defineRoute({
      method: 'get', path: '/foods', access: access.signedIn, query: foodSearchQuerySchema, response: foodSearchPageSchema,
      summary: 'Ranked, typo-tolerant food search; `nextCursor` pages on.',
      handler: async ({ query, user }, _req, res) => res.json(await searchFoods(query, user.id)),
    }),
    defineRoute({
      method: 'get', path: '/foods/:id', access: access.signedIn, params: idParamSchema, response: foodBody,
      summary: 'Every value, which carbohydrate was published and which derived, household measures, source and licence.',
      handler: async ({ params, user }, _req, res) => res.json({ food: await getFood(params.id, user.id) }),
    }),
    defineRoute({
      method: 'get', path: '/foods/:id/photo', access: access.signedIn, params: idParamSchema, status: 302,
      summary: 'Redirects to a signed link to the label photo (for people who may see the food).',
      handler: async ({ params, user }, _req, res) => res.redirect(302, signedPhotoUrl(await getFoodPhotoPath(params.id, user.id))),
    }),
    defineRoute({
      method: 'post', path: '/foods', access: access.signedIn, before: [packPhotoUpload], body: createPackFoodInputSchema, bodyFormat: 'multipart',
      status: 201, response: foodBody,
      summary: 'Add a pack food (JSON, or multipart with `data` = JSON and `photo` = JPEG/PNG/WebP ≤ 8 MB, re-encoded without EXIF).',
      handler: async ({ body, user }, req, res) => {
        const photo = req.file ? { buffer: req.file.buffer, storage: deps.storage, photos: deps.photos } : undefined;
        res.status(201).json({ food: await createPackFood(user.id, body, photo) });
      },
    }),
    defineRoute({
      method: 'put', path: '/foods/:id', access: access.signedIn, params: idParamSchema, body: createPackFoodInputSchema, response: foodBody,
      summary: 'Edit your pack food (same body as POST, JSON; the photo stays). Recipes count the new values from now on; batches keep theirs.',
      handler: async ({ params, body, user }, _req, res) => res.json({ food: await updatePackFood(params.id, user.id, body) }),
    }),
    defineRoute({
      method: 'delete', path: '/foods/:id', access: access.signedIn, params: idParamSchema, status: 204,
      summary: 'Delete your pack food (409 while your recipes use it; `fieldErrors.recipes` lists their titles).',
      handler: async ({ params, user }, _req, res) => {
        await deletePackFood(params.id, user.id, deps.storage);
        res.status(204).end();
      },
    }),
  ];
}
