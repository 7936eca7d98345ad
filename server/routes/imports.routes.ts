import fs from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { Router, type NextFunction, type Request, type Response } from 'express';
import multer from 'multer';
import type { Sequelize } from 'sequelize';
import { z } from 'zod';
import { idParamSchema } from '../../shared/schemas/common';
import type { Config } from '../config';
import { AppError } from '../errors';
import { requireAuth, requireRole } from '../middleware/auth';
import { validate } from '../middleware/validate';
import { getImport, listImports, startImportJob } from '../services/imports.service';

const FILES: Record<'fdc' | 'sr28', string[]> = {
  fdc: ['food.csv', 'nutrient.csv', 'food_nutrient.csv', 'food_portion.csv', 'measure_unit.csv', 'food_category.csv', 'sr_legacy_food.csv'],
  sr28: ['FOOD_DES.txt', 'NUT_DATA.txt', 'NUTR_DEF.txt', 'WEIGHT.txt', 'FD_GROUP.txt'],
};
const kindSchema = z.object({ kind: z.enum(['fdc', 'sr28']) });

const upload = multer({
  storage: multer.diskStorage({ destination: (_req, _file, cb) => cb(null, os.tmpdir()) }),
  limits: { fileSize: 512 * 1024 * 1024, files: 12 },
});

function receiveFiles(req: Request, res: Response, next: NextFunction) {
  upload.array('files', 12)(req, res, (err: unknown) => {
    if (err instanceof multer.MulterError) return next(AppError.validation({ files: [`Upload failed: ${err.message}.`] }));
    next(err);
  });
}

async function removeUploads(files: Express.Multer.File[]) {
  await Promise.all(files.map((f) => fs.rm(f.path, { force: true })));
}

/** Admin dataset imports: upload USDA files, then poll the import record for progress and the report. */
export function importsRouter(config: Config, sequelize: Sequelize) {
  const router = Router();
  router.use('/admin/imports', requireAuth(config), requireRole('admin'));

  router.get('/admin/imports', async (_req, res) => {
    res.json({ imports: await listImports() });
  });

  router.get('/admin/imports/:id', validate({ params: idParamSchema }), async (req, res) => {
    res.json({ import: await getImport(Number(req.params.id)) });
  });

  router.post('/admin/imports', receiveFiles, async (req, res) => {
    const files = (req.files as Express.Multer.File[] | undefined) ?? [];
    const kind = kindSchema.safeParse(req.body ?? {});
    if (!kind.success) {
      await removeUploads(files);
      throw AppError.validation({ kind: ['Choose FoodData Central CSV (fdc) or SR28 ASCII (sr28).'] });
    }
    const allowed = FILES[kind.data.kind];
    const unknown = files.filter((f) => !allowed.includes(f.originalname));
    if (!files.length || unknown.length) {
      await removeUploads(files);
      const why = files.length ? `Unexpected file ${unknown.map((f) => f.originalname).join(', ')}.` : 'Choose the files to import.';
      throw AppError.validation({ files: [`${why} Expected: ${allowed.join(', ')}.`] });
    }
    const folder = await fs.mkdtemp(path.join(os.tmpdir(), 'cw-import-'));
    await Promise.all(files.map((f) => fs.rename(f.path, path.join(folder, f.originalname)).catch(() => fs.copyFile(f.path, path.join(folder, f.originalname)))));
    await removeUploads(files);
    const record = await startImportJob(sequelize, kind.data.kind, folder, req.auth!.user.id, folder);
    res.status(202).json({ import: record });
  });

  return router;
}
