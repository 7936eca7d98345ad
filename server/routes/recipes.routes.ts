import multer from 'multer';
import { idParamSchema } from '../../shared/schemas/common';
import { recipeInputSchema, recipeListQuerySchema, recipeShareParamsSchema, recipeViewQuerySchema, shareRecipeInputSchema } from '../../shared/schemas/recipe';
import { removeRecipePhoto, setRecipePhoto } from '../services/photos.service';
import { answerOffer, copyRecipe, listOffersForMe, listOffersOfRecipe, listShares, offerRecipe, revokeShare } from '../services/recipe-sharing.service';
import { createRecipe, deleteRecipe, getRecipeForUser, listRecipes, updateRecipe } from '../services/recipes.service';
import { access, defineRoute, type AnyRoute, type AppDeps } from './registry';

/** Recipes: library shelves, the recipe page with its computed breakdown, editing, photos, sharing, copying. */
export function recipesRoutes({ storage, photos }: AppDeps): AnyRoute[] {
  const upload = multer({ storage: multer.memoryStorage(), limits: { fileSize: 10 * 1024 * 1024, files: 1, fields: 5 } });
  const signedIn = access.signedIn;
  const params = idParamSchema;
  return [
    defineRoute({
      method: 'get', path: '/recipes', access: signedIn, query: recipeListQuerySchema,
      summary: 'One library shelf (`scope=mine|shared|public`), searched by title, tag and ingredient, sorted.',
      handler: async ({ query, user }, _req, res) => res.json({ items: await listRecipes(query, user.id) }),
    }),
    defineRoute({
      method: 'post', path: '/recipes', access: signedIn, body: recipeInputSchema, status: 201,
      summary: 'Create a recipe (ingredients in order; 400 with `ingredients.N.field` errors).',
      handler: async ({ body, user }, _req, res) => res.status(201).json(await createRecipe(body, user.id)),
    }),
    defineRoute({
      method: 'get', path: '/recipes/:id', access: signedIn, params, query: recipeViewQuerySchema,
      summary: 'The recipe page with the computed breakdown in the profile\'s basis and unit, optionally scaled (who may see it).',
      handler: async ({ params: p, query, user }, _req, res) => res.json(await getRecipeForUser(p.id, user.id, query)),
    }),
    defineRoute({
      method: 'put', path: '/recipes/:id', access: signedIn, params, body: recipeInputSchema,
      summary: 'Replace a recipe (owner; cooked batches keep their snapshot; saving as private withdraws every share).',
      handler: async ({ params: p, body, user }, _req, res) => res.json(await updateRecipe(p.id, body, user.id)),
    }),
    defineRoute({
      method: 'delete', path: '/recipes/:id', access: signedIn, params, status: 204, summary: 'Delete a recipe (owner).',
      handler: async ({ params: p, user }, _req, res) => {
        const keys = await deleteRecipe(p.id, user.id);
        await Promise.all(keys.map((k) => storage.remove(k)));
        res.status(204).end();
      },
    }),
    defineRoute({
      method: 'post', path: '/recipes/:id/copy', access: signedIn, params, status: 201,
      summary: 'An independent private copy that remembers where it came from (who may see it).',
      handler: async ({ params: p, user }, _req, res) => res.status(201).json(await copyRecipe(p.id, user.id, storage)),
    }),
    defineRoute({
      method: 'put', path: '/recipes/:id/photo', access: signedIn, params, before: [upload.single('photo')], bodyFormat: 'multipart',
      summary: 'Upload the photo (owner; multipart field `photo`, 10 MB; JPEG, PNG or WebP checked by its bytes; re-encoded).',
      handler: async ({ params: p, user }, req, res) => res.json(await setRecipePhoto(p.id, user.id, req.file?.buffer, { storage, processor: photos })),
    }),
    defineRoute({
      method: 'delete', path: '/recipes/:id/photo', access: signedIn, params, status: 204, summary: 'Remove the photo (owner).',
      handler: async ({ params: p, user }, _req, res) => {
        await removeRecipePhoto(p.id, user.id, storage);
        res.status(204).end();
      },
    }),
    defineRoute({
      method: 'get', path: '/recipes/:id/shares', access: signedIn, params, summary: 'Who has accepted the owner\'s offer (`items`) and the offers still open (`offers`).',
      handler: async ({ params: p, user }, _req, res) => res.json({ items: await listShares(p.id, user.id), offers: await listOffersOfRecipe(p.id, user.id) }),
    }),
    defineRoute({
      method: 'post', path: '/recipes/:id/shares', access: signedIn, params, body: shareRecipeInputSchema, status: 202,
      summary: 'Offer the recipe to `{ email }` (owner): the same 202 whether or not an account uses it; they accept or decline. At most 20 offers an hour (429).',
      handler: async ({ params: p, body, user }, _req, res) => {
        await offerRecipe(p.id, user.id, body.email);
        res.status(202).json({ status: 'offered' });
      },
    }),
    defineRoute({
      method: 'delete', path: '/recipes/:id/shares/:userId', access: signedIn, params: recipeShareParamsSchema, status: 204,
      summary: 'Withdraw one person\'s access (owner); their copies stay theirs.',
      handler: async ({ params: p, user }, _req, res) => {
        await revokeShare(p.id, user.id, p.userId);
        res.status(204).end();
      },
    }),
    defineRoute({
      method: 'get', path: '/recipe-offers', access: signedIn, summary: 'Recipes offered to me and not yet answered.',
      handler: async ({ user }, _req, res) => res.json({ items: await listOffersForMe(user.id) }),
    }),
    defineRoute({
      method: 'post', path: '/recipe-offers/:id/accept', access: signedIn, params, status: 204, summary: 'Accept an offer: the recipe joins my shared shelf.',
      handler: async ({ params: p, user }, _req, res) => {
        await answerOffer(p.id, user.id, true);
        res.status(204).end();
      },
    }),
    defineRoute({
      method: 'post', path: '/recipe-offers/:id/decline', access: signedIn, params, status: 204, summary: 'Decline an offer.',
      handler: async ({ params: p, user }, _req, res) => {
        await answerOffer(p.id, user.id, false);
        res.status(204).end();
      },
    }),
  ];
}
