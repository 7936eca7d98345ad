import { z } from 'zod';
import { wholeNumberText } from '../../shared/schemas/fields';
import { AppError } from '../errors';
import { isValidStorageKey } from '../lib/storage';
import { verifyPhotoLink } from '../services/photos.service';
import { access, defineRoute, type AnyRoute, type AppDeps } from './registry';

// Label photos stored before re-encoding kept their type and a dashed UUID name; they are served as stored.
const photoParams = z.object({
  folder: z.enum(['recipes', 'label-photos']),
  file: z.string().regex(/^[a-f0-9-]{32,36}\.(jpg|png|webp)$/, 'Not a photo name.'),
});
const photoQuery = z.object({ exp: wholeNumberText('Not a valid link.'), sig: z.string().max(100) });
const TYPES = { jpg: 'image/jpeg', png: 'image/png', webp: 'image/webp' } as const;

/**
 * Every stored photo (recipe photos, label photos) through short-lived signed links (an <img> cannot send the
 * bearer token). Links are only handed out to people who may see the photo; a wrong or expired link is a 404.
 */
export function photosRoutes({ storage }: AppDeps): AnyRoute[] {
  return [
    defineRoute({
      method: 'get', path: '/photos/:folder/:file', access: access.signedLink, params: photoParams, query: photoQuery,
      summary: 'A stored photo through a signed link (`exp`, `sig`); 404 when the link is wrong or expired.',
      handler: async ({ params, query }, _req, res) => {
        const key = `${params.folder}/${params.file}`;
        if (!isValidStorageKey(key) || !verifyPhotoLink(key, query.exp, query.sig)) throw AppError.notFound('photo');
        const data = await storage.get(key);
        if (!data) throw AppError.notFound('photo');
        res.set('Cache-Control', 'private, max-age=3600, immutable');
        res.type(TYPES[key.slice(key.lastIndexOf('.') + 1) as keyof typeof TYPES]).send(data);
      },
    }),
  ];
}
