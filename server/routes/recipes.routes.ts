import { Router } from 'express';
import multer from 'multer';
import { idParamSchema } from '../../shared/schemas/common';
import {
  recipeInputSchema,
  recipeListQuerySchema,
  recipeShareParamsSchema,
  recipeViewQuerySchema,
  shareRecipeInputSchema,
  type RecipeInputParsed,
  type RecipeListQuery,
  type RecipeViewQuery,
} from '../../shared/schemas/recipe';
import type { Config } from '../config';
import { PhotoProcessor } from '../lib/photo-worker';
import { localDiskStorage } from '../lib/storage';
import { requireAuth } from '../middleware/auth';
import { validate } from '../middleware/validate';
import { removeRecipePhoto, setRecipePhoto } from '../services/photos.service';
import { copyRecipe, listShares, revokeShare, shareRecipe } from '../services/recipe-sharing.service';
import { createRecipe, deleteRecipe, getRecipeForUser, listRecipes, updateRecipe } from '../services/recipes.service';

/** Photos are decoded at most two at a time per server process, whatever the number of apps built. */
const processor = new PhotoProcessor(2);

/** Recipes: library shelves, the recipe page with its computed breakdown, editing, photos, sharing, copying. */
export function recipesRouter(config: Config) {
  const router = Router();
  const auth = requireAuth(config);
  const storage = localDiskStorage(config.UPLOADS_DIR);
  const upload = multer({ storage: multer.memoryStorage(), limits: { fileSize: 10 * 1024 * 1024, files: 1, fields: 5 } });
  const id = validate({ params: idParamSchema });
  const userId = (req: { auth?: { user: { id: number } } }) => req.auth!.user.id;

  router.get('/recipes', auth, validate({ query: recipeListQuerySchema }), async (req, res) => {
    res.json({ items: await listRecipes(req.query as unknown as RecipeListQuery, userId(req)) });
  });
  router.post('/recipes', auth, validate({ body: recipeInputSchema }), async (req, res) => {
    res.status(201).json(await createRecipe(req.body as RecipeInputParsed, userId(req)));
  });
  router.get('/recipes/:id', auth, validate({ params: idParamSchema, query: recipeViewQuerySchema }), async (req, res) => {
    res.json(await getRecipeForUser(Number(req.params.id), userId(req), req.query as unknown as RecipeViewQuery));
  });
  router.put('/recipes/:id', auth, validate({ params: idParamSchema, body: recipeInputSchema }), async (req, res) => {
    res.json(await updateRecipe(Number(req.params.id), req.body as RecipeInputParsed, userId(req)));
  });
  router.delete('/recipes/:id', auth, id, async (req, res) => {
    const keys = await deleteRecipe(Number(req.params.id), userId(req));
    await Promise.all(keys.map((k) => storage.remove(k)));
    res.status(204).end();
  });
  router.post('/recipes/:id/copy', auth, id, async (req, res) => {
    res.status(201).json(await copyRecipe(Number(req.params.id), userId(req), storage));
  });
  router.put('/recipes/:id/photo', auth, id, upload.single('photo'), async (req, res) => {
    res.json(await setRecipePhoto(Number(req.params.id), userId(req), req.file?.buffer, { storage, processor }));
  });
  router.delete('/recipes/:id/photo', auth, id, async (req, res) => {
    await removeRecipePhoto(Number(req.params.id), userId(req), storage);
    res.status(204).end();
  });
  router.get('/recipes/:id/shares', auth, id, async (req, res) => {
    res.json({ items: await listShares(Number(req.params.id), userId(req)) });
  });
  router.post('/recipes/:id/shares', auth, validate({ params: idParamSchema, body: shareRecipeInputSchema }), async (req, res) => {
    res.status(201).json({ items: await shareRecipe(Number(req.params.id), userId(req), (req.body as { email: string }).email) });
  });
  router.delete('/recipes/:id/shares/:userId', auth, validate({ params: recipeShareParamsSchema }), async (req, res) => {
    await revokeShare(Number(req.params.id), userId(req), Number(req.params.userId));
    res.status(204).end();
  });
  return router;
}
