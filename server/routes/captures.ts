import { Router } from 'express';
import multer from 'multer';
import { mkdirSync } from 'node:fs';
import { rm } from 'node:fs/promises';
import path from 'node:path';
import { pipeline } from 'node:stream/promises';
import { CaptureListQuery, SampleRateRequest, SamplesQuery, UpdateCaptureRequest, UploadFields } from '../../shared/schemas/capture';
import { IdParam } from '../../shared/schemas/user';
import type { AppContext } from '../context';
import { findCaptureRow } from '../db/captureRepository';
import { AppError, notFound } from '../errors';
import { allow, currentUser } from '../middleware/auth';
import { acceptUpload, captureAnalysis, captureDetail, captureList, deleteCapture, provideSampleRate, reanalyseOutdated, updateCapture } from '../services/captureService';
import { originalStream } from '../services/originalFiles';
import { sampleWindowData } from '../services/sampleWindowService';
import { sendSamples } from './sendSamples';
import { hashingDiskStorage } from '../services/hashingStorage';
import { spanFigures } from '../services/spanFiguresService';
import { SpanFiguresQuery } from '../../shared/schemas/spanFigures';

const formatBytes = (n: number) => {
  const units = ['bytes', 'KiB', 'MiB', 'GiB', 'TiB'];
  let i = 0;
  while (n >= 1024 && i < units.length - 1) {
    n /= 1024;
    i++;
  }
  return `${Number(n.toPrecision(3))} ${units[i]}`;
};

/**
 * Routes under /captures/:id pass projectScopes first: a capture in a project hidden from the user
 * answers 404, and allow() checks the user's role in the capture's project.
 */
export function captureRoutes(ctx: AppContext, onQueued: () => void): Router {
  const tmp = path.join(ctx.config.DATA_DIR, 'uploads');
  mkdirSync(tmp, { recursive: true });
  // multer streams the file to disk; it is never held in memory whole.
  const upload = multer({ storage: hashingDiskStorage(tmp), limits: { fileSize: ctx.config.UPLOAD_LIMIT_BYTES, files: 1, fields: 10 } }).single('file');
  const limit = formatBytes(ctx.config.UPLOAD_LIMIT_BYTES);

  return Router()
    .post('/captures', allow('admin', 'engineer'), (req, res, next) => {
      upload(req, res, (err: unknown) => {
        if (err instanceof multer.MulterError && err.code === 'LIMIT_FILE_SIZE') {
          return next(new AppError(413, 'too_large', `The file is larger than the upload limit of ${limit}`));
        }
        if (err instanceof multer.MulterError) return next(new AppError(400, 'bad_upload', `The upload is not valid: ${err.message}`));
        next(err);
      });
    }, async (req, res) => {
      if (!req.file) throw new AppError(400, 'no_file', 'Attach the capture file as the form field "file"');
      try {
        const result = await acceptUpload(ctx, currentUser(req), req.file, UploadFields.parse(req.body ?? {}));
        if (!result.duplicate) onQueued();
        res.status(result.duplicate ? 200 : 202).json(result);
      } finally {
        // Kept files were moved away; whatever is left here (bad fields, a failure) is only temporary.
        await rm(req.file.path, { force: true });
      }
    })
    .get('/captures', async (req, res) => {
      res.json(await captureList(ctx, currentUser(req), CaptureListQuery.parse(req.query)));
    })
    .get('/captures/:id', async (req, res) => {
      res.json(await captureDetail(ctx, IdParam.parse(req.params).id));
    })
    .patch('/captures/:id', allow('admin', 'engineer'), async (req, res) => {
      res.json(await updateCapture(ctx, currentUser(req), IdParam.parse(req.params).id, UpdateCaptureRequest.parse(req.body)));
    })
    .delete('/captures/:id', allow('admin', 'engineer'), async (req, res) => {
      await deleteCapture(ctx, currentUser(req), IdParam.parse(req.params).id);
      res.status(204).end();
    })
    .post('/captures/:id/sample-rate', allow('admin', 'engineer'), async (req, res) => {
      const detail = await provideSampleRate(ctx, currentUser(req), IdParam.parse(req.params).id, SampleRateRequest.parse(req.body).sampleRate);
      onQueued();
      res.status(202).json(detail);
    })
    .get('/captures/:id/analysis', async (req, res) => {
      res.json(await captureAnalysis(ctx, IdParam.parse(req.params).id));
    })
    .get('/captures/:id/figures', async (req, res) => {
      res.json(await spanFigures(ctx, IdParam.parse(req.params).id, SpanFiguresQuery.parse(req.query)));
    })
    .get('/captures/:id/samples', async (req, res) => {
      sendSamples(req, res, await sampleWindowData(ctx, IdParam.parse(req.params).id, SamplesQuery.parse(req.query)));
    })
    .get('/captures/:id/original', async (req, res) => {
      const row = await findCaptureRow(ctx.db, IdParam.parse(req.params).id);
      if (!row?.originalPath) throw notFound('Original file');
      res.attachment(row.originalName);
      res.type('text/csv');
      await pipeline(originalStream(ctx, row.originalPath), res);
    })
    .post('/admin/reanalyse', allow('admin'), async (_req, res) => {
      const queued = await reanalyseOutdated(ctx);
      if (queued) onQueued();
      res.json({ queued });
    });
}
