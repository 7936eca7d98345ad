import fs from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import type { NextFunction, Request, Response } from 'express';
import multer from 'multer';
import { z } from 'zod';
import { idParamSchema } from '../../shared/schemas/common';
import { datasetImportSchema } from '../../shared/schemas/food';
import { AppError } from '../errors';
import { getImport, listImports, startImportJob } from '../services/imports.service';
import { access, defineRoute, type AnyRoute, type AppDeps } from './registry';

const FILES: Record<'fdc' | 'sr28', string[]> = {
  fdc: ['food.csv', 'nutrient.csv', 'food_nutrient.csv', 'food_portion.csv', 'measure_unit.csv', 'food_category.csv', 'sr_legacy_food.csv'],
  sr28: ['FOOD_DES.txt', 'NUT_DATA.txt', 'NUTR_DEF.txt', 'WEIGHT.txt', 'FD_GROUP.txt'],
};
const kindSchema = z.object({
  kind: z.enum(['fdc', 'sr28']),
  mode: z.enum(['apply', 'preview']).default('apply'),
  confirm: z.enum(['true', 'false']).default('false'),
});

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

const importBody = z.object({ import: datasetImportSchema });

/** Admin dataset imports: upload USDA files, then poll the import record for progress and the report. */
export function importsRoutes({ sequelize }: AppDeps): AnyRoute[] {
  const admin = access.role('admin');
  return [
    defineRoute({
      method: 'get', path: '/admin/imports', access: admin, response: z.object({ imports: z.array(datasetImportSchema) }),
      summary: 'Dataset imports with status, counts, skipped rows and reasons.',
      handler: async (_ctx, _req, res) => res.json({ imports: await listImports() }),
    }),
    defineRoute({
      method: 'get', path: '/admin/imports/:id', access: admin, params: idParamSchema, response: importBody,
      summary: 'One import (poll while it runs).',
      handler: async ({ params }, _req, res) => res.json({ import: await getImport(params.id) }),
    }),
    defineRoute({
      // The body is checked in the handler: a refused upload must also delete the files already received.
      method: 'post', path: '/admin/imports', access: admin, before: [receiveFiles], bodyFormat: 'multipart', status: 202, response: importBody,
      summary:
        'Upload USDA files (multipart: `kind` = `fdc` or `sr28`, `files[]`, optional `mode` = `preview` to record the diff only, ' +
        '`confirm` = `true` to apply an import that would blank foods) → 202, then poll.',
      handler: async ({ user }, req, res) => {
        const files = (req.files as Express.Multer.File[] | undefined) ?? [];
        const kind = kindSchema.safeParse(req.body ?? {});
        if (!kind.success) {
          await removeUploads(files);
          throw AppError.validation({ kind: ['Choose FoodData Central CSV (fdc) or SR28 ASCII (sr28); `mode` apply or preview; `confirm` true or false.'] });
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
        const mode = { preview: kind.data.mode === 'preview', confirm: kind.data.confirm === 'true' };
        const record = await startImportJob(sequelize, kind.data.kind, folder, user.id, folder, mode);
        res.status(202).json({ import: record });
      },
    }),
  ];
}
