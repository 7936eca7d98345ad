import type { NextFunction, Request, Response } from 'express';
import multer from 'multer';
import { profileIdParamSchema } from '../../shared/schemas/common';
import { logHistoryQuerySchema, logPeriodQuerySchema, readingsImportColumnsSchema } from '../../shared/schemas/logbook-read';
import { AppError } from '../errors';
import { exportLogCsv } from '../services/log-export.service';
import { listLogHistory, logCharts, logReview } from '../services/log-history.service';
import { importReadings, previewReadingsImport } from '../services/readings-import.service';
import { access, defineRoute, type AnyRoute } from './registry';

/** Largest readings file accepted (README, data formats). */
export const READINGS_FILE_MAX_BYTES = 10 * 1024 * 1024;

const upload = multer({ storage: multer.memoryStorage(), limits: { fileSize: READINGS_FILE_MAX_BYTES, files: 1 } });

function receiveFile(req: Request, res: Response, next: NextFunction) {
  upload.single('file')(req, res, (err: unknown) => {
    if (err instanceof multer.MulterError) {
      const why = err.code === 'LIMIT_FILE_SIZE' ? 'The file is larger than 10 MB.' : `Upload failed: ${err.message}.`;
      return next(AppError.validation({ file: [why] }));
    }
    next(err);
  });
}

function uploadedBytes(req: Request): Buffer {
  if (!req.file) throw AppError.validation({ file: ['Choose a CSV or TSV file of glucose readings.'] });
  return req.file.buffer;
}

function mappingErrors(error: { issues: { path: PropertyKey[]; message: string }[] }) {
  const fields: Record<string, string[]> = {};
  for (const issue of error.issues) (fields[String(issue.path[0] ?? 'file')] ??= []).push(issue.message);
  return AppError.validation(fields);
}

/** Reading the logbook: history, charts data, the ratio review, the CSV export and the glucose readings import. */
export function logHistoryRoutes(): AnyRoute[] {
  return [
    defineRoute({
      method: 'get', path: '/profiles/:profileId/logbook/history', access: access.profile('log.read'),
      params: profileIdParamSchema, query: logHistoryQuerySchema,
      summary: 'One page of the logbook (filters: from, to, dayKindId, kinds; sort newest|oldest; cursor, limit); meals with reading before, suggested and taken dose.',
      handler: async ({ params, query }, _req, res) => res.json(await listLogHistory(params.profileId, query)),
    }),
    defineRoute({
      method: 'get', path: '/profiles/:profileId/logbook/charts', access: access.profile('log.read'),
      params: profileIdParamSchema, query: logPeriodQuerySchema,
      summary: 'Chart data for local dates from..to: per-day carbohydrate and insulin, glucose before meals per day kind, time in range.',
      handler: async ({ params, query }, _req, res) => res.json(await logCharts(params.profileId, query)),
    }),
    defineRoute({
      method: 'get', path: '/profiles/:profileId/logbook/review', access: access.profile('log.read'),
      params: profileIdParamSchema, query: logPeriodQuerySchema,
      summary: 'The ratio review for from..to: average glucose change after meals per day kind and time of day, with meal counts and the caution.',
      handler: async ({ params, query }, _req, res) => res.json(await logReview(params.profileId, query)),
    }),
    defineRoute({
      method: 'get', path: '/profiles/:profileId/logbook/export.csv', access: access.profile('log.read'),
      params: profileIdParamSchema, query: logPeriodQuerySchema,
      summary: 'The logbook of from..to as CSV (UTF-8, comma separated, units in the headers).',
      handler: async ({ params, query }, _req, res) => {
        const { csv, filename } = await exportLogCsv(params.profileId, query);
        res.attachment(filename).type('text/csv; charset=utf-8').send(csv);
      },
    }),
    defineRoute({
      method: 'post', path: '/profiles/:profileId/logbook/readings-import/preview', access: access.profile('log.write'),
      params: profileIdParamSchema, before: [receiveFile], bodyFormat: 'multipart',
      summary: 'Reads a glucose readings file (multipart `file`, optional mapping fields) and answers its columns, the mapping and the first rows as they would be stored.',
      handler: async ({ params }, req, res) => {
        const chosen = readingsImportColumnsSchema.partial().safeParse(req.body ?? {});
        if (!chosen.success) throw mappingErrors(chosen.error);
        res.json(await previewReadingsImport(params.profileId, uploadedBytes(req), chosen.data));
      },
    }),
    defineRoute({
      method: 'post', path: '/profiles/:profileId/logbook/readings-import', access: access.profile('log.write'),
      params: profileIdParamSchema, before: [receiveFile], bodyFormat: 'multipart', status: 201,
      summary: 'Imports every reading of the file in one transaction (multipart `file`, timeColumn, valueColumn, unitColumn?, unit, dateOrder?); a bad line refuses the file (422).',
      handler: async ({ params, user }, req, res) => {
        const mapping = readingsImportColumnsSchema.safeParse(req.body ?? {});
        if (!mapping.success) throw mappingErrors(mapping.error);
        res.status(201).json(await importReadings(params.profileId, user.id, uploadedBytes(req), mapping.data));
      },
    }),
  ];
}
