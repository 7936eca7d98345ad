import { Router } from 'express';
import { z } from 'zod';
import type { Config } from '../config';
import { AppError } from '../errors';
import { isValidStorageKey, localDiskStorage } from '../lib/storage';
import { validate } from '../middleware/validate';
import { configurePhotoSigning, verifyPhotoLink } from '../services/photos.service';

const photoParams = z.object({ folder: z.enum(['recipes']), file: z.string().regex(/^[a-f0-9]{32}\.jpg$/, 'Not a photo name.') });
const photoQuery = z.object({ exp: z.coerce.number().int(), sig: z.string().max(100) });

/**
 * Stored photos through short-lived signed links (an <img> cannot send the bearer token). Links are only
 * handed out with a recipe to people who may see it; a wrong or expired link is a 404.
 */
export function photosRouter(config: Config) {
  const router = Router();
  const storage = localDiskStorage(config.UPLOADS_DIR);
  configurePhotoSigning(config.jwtSecret);
  router.get('/photos/:folder/:file', validate({ params: photoParams, query: photoQuery }), async (req, res) => {
    const key = `${req.params.folder}/${req.params.file}`;
    const { exp, sig } = req.query as unknown as z.infer<typeof photoQuery>;
    if (!isValidStorageKey(key) || !verifyPhotoLink(key, exp, sig)) throw AppError.notFound('photo');
    const data = await storage.get(key);
    if (!data) throw AppError.notFound('photo');
    res.set('Cache-Control', 'private, max-age=3600, immutable');
    res.type('image/jpeg').send(data);
  });
  return router;
}
