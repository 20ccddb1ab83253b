import { Router, type Request } from 'express';
import multer from 'multer';
import { mkdirSync } from 'node:fs';
import { rm } from 'node:fs/promises';
import path from 'node:path';
import { pipeline } from 'node:stream/promises';
import { CaptureListQuery, ComtradeValuesRequest, OriginalQuery, SampleRateRequest, SamplesQuery, UpdateCaptureRequest, UploadFields } from '../../shared/schemas/capture';
import { IdParam } from '../../shared/schemas/user';
import type { AppContext } from '../context';
import { findCaptureRow } from '../db/captureRepository';
import { AppError, notFound } from '../errors';
import { allow, currentUser } from '../middleware/auth';
import { acceptUpload, captureAnalysis, captureDetail, captureList, deleteCapture, provideSampleRate, reanalyseOutdated, setComtradeValues, updateCapture } from '../services/captureService';
import { keptFile, originalStream } from '../services/originalFiles';
import { sampleWindowData } from '../services/sampleWindowService';
import { sendSamples } from './sendSamples';
import type { EarlyReading } from '../jobs/earlyReading';
import { hashingDiskStorage, type FileTap } from '../services/hashingStorage';
import { isCsvName } from '../services/uploadFormat';
import { spanFigures } from '../services/spanFiguresService';
import { SpanFiguresQuery } from '../../shared/schemas/spanFigures';

/** Keeps a processing slot for an upload of about so many bytes, to read it as it arrives (or null). */
export type ReadUpload = (expectedBytes: number) => EarlyReading | null;

const earlyReadingOf = (req: Request): EarlyReading | null => (req.res?.locals.earlyReading as EarlyReading | undefined) ?? null;

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
export function captureRoutes(ctx: AppContext, onQueued: () => void, readUpload: ReadUpload = () => null): Router {
  const tmp = path.join(ctx.config.DATA_DIR, 'uploads');
  mkdirSync(tmp, { recursive: true });
  // A CSV in `file` goes to the reading kept for this request, if any, as it arrives.
  const tap: FileTap = (req, file) => {
    const reading = earlyReadingOf(req);
    if (!reading || file.fieldname !== 'file' || !isCsvName(file.originalname)) return null;
    file.stream.once('end', () => reading.arrived());
    return (chunk) => reading.push(chunk);
  };
  // multer streams the files to disk; none is ever held in memory whole. `data` carries a COMTRADE
  // .dat beside its .cfg in `file`; the size limit applies to each file.
  const upload = multer({ storage: hashingDiskStorage(tmp, tap), limits: { fileSize: ctx.config.UPLOAD_LIMIT_BYTES, files: 2, fields: 10 } }).fields([
    { name: 'file', maxCount: 1 },
    { name: 'data', maxCount: 1 },
  ]);
  const limit = formatBytes(ctx.config.UPLOAD_LIMIT_BYTES);

  return Router()
    .post('/captures', allow('admin', 'engineer'), (req, res, next) => {
      // Asked only once the sender may upload. The request's length stands for the file's size (it only
      // sizes the columns, which the sample budget caps anyway); no more than the upload limit is believed.
      const reading = readUpload(Math.min(Number(req.headers['content-length']) || 0, ctx.config.UPLOAD_LIMIT_BYTES));
      if (reading) {
        res.locals.earlyReading = reading;
        // However the request ends, a reading its capture did not take over frees its slot.
        res.once('close', () => reading.drop());
      }
      upload(req, res, (err: unknown) => {
        if (err instanceof multer.MulterError && err.code === 'LIMIT_FILE_SIZE') {
          return next(new AppError(413, 'too_large', `The file is larger than the upload limit of ${limit}`));
        }
        if (err instanceof multer.MulterError) return next(new AppError(400, 'bad_upload', `The upload is not valid: ${err.message}`));
        next(err);
      });
    }, async (req, res) => {
      const files = (req.files ?? {}) as Record<string, Express.Multer.File[] | undefined>;
      const [file, data] = [files.file?.[0], files.data?.[0] ?? null];
      try {
        if (!file) throw new AppError(400, 'no_file', 'Attach the capture file as the form field "file"');
        const result = await acceptUpload(ctx, currentUser(req), file, UploadFields.parse(req.body ?? {}), data, earlyReadingOf(req));
        if (!result.duplicate) onQueued();
        res.status(result.duplicate ? 200 : 202).json(result);
      } finally {
        // Kept files were moved away; whatever is left here (bad fields, a failure) is only temporary.
        await Promise.all([file, data].map((f) => f && rm(f.path, { force: true })));
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
    .post('/captures/:id/comtrade-values', allow('admin', 'engineer'), async (req, res) => {
      const detail = await setComtradeValues(ctx, currentUser(req), IdParam.parse(req.params).id, ComtradeValuesRequest.parse(req.body).values);
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
      const kept = keptFile(row, OriginalQuery.parse(req.query).part);
      if (!kept) throw notFound('Original file');
      res.attachment(kept.name);
      res.type(kept.type);
      await pipeline(originalStream(ctx, kept.path), res);
    })
    .post('/admin/reanalyse', allow('admin'), async (_req, res) => {
      const queued = await reanalyseOutdated(ctx);
      if (queued) onQueued();
      res.json({ queued });
    });
}
