import { eq } from 'drizzle-orm';
import { rm } from 'node:fs/promises';
import { ENGINE_VERSION } from '../../shared/analysis';
import type { AnalysisResponse, CaptureDetail, CaptureList, CaptureListQuery, UpdateCaptureRequest, UploadFields, UploadResponse } from '../../shared/schemas/capture';
import type { User } from '../../shared/schemas/user';
import type { AppContext } from '../context';
import { channelAnalyses, powerQualityOf, findCaptureBySha, findCaptureDetail, findCaptureRow, listCaptures } from '../db/captureRepository';
import { findProject } from '../db/projectRepository';
import { retryOnDeadlock } from '../db/retryOnDeadlock';
import { captures } from '../db/schema';
import { AppError, forbidden, notFound } from '../errors';
import type { EarlyReading } from '../jobs/earlyReading';
import { enqueue, enqueueClaimed, type ClaimedJob } from '../jobs/jobQueue';
import { keepOriginal, removeCaptureFiles, sha256OfFile } from './originalFiles';
import { defaultProjectId } from './projectService';
import { uploadFormat } from './uploadFormat';
import { requireRoleIn, visibleProject } from './visibility';

export interface UploadedFile {
  path: string;
  originalname: string;
  size: number;
  /** Taken while the upload streamed in (hashingDiskStorage); computed here when absent. */
  sha256?: string;
}

/**
 * Takes an uploaded file: files it under the named (or the uploader's default) project, recognises a
 * second upload of the same bytes to that project as the existing capture, keeps the original, and queues it for processing, all before
 * answering, so the upload returns at once whatever the file's size. A COMTRADE .cfg comes with its
 * .dat (`data`): both are kept, and their bytes one after the other make the SHA-256 (read again here:
 * the hashes taken while each streamed in cannot be joined). A CSV this process read as it arrived
 * (`early`) is processed from that reading: its job is inserted claimed, and handed over once committed.
 */
export async function acceptUpload(ctx: AppContext, user: User, file: UploadedFile, fields: UploadFields, data: UploadedFile | null = null, early: EarlyReading | null = null): Promise<UploadResponse> {
  try {
    const kind = uploadFormat(file.originalname, data?.originalname ?? null);
    const projectId = fields.projectId ?? (await defaultProjectId(ctx, user.id, user.name));
    // The project is named in the form, not the path, so projectScopes has not seen it.
    requireRoleIn(await visibleProject(ctx, user, projectId), 'admin', 'engineer');
    const project = await findProject(ctx.db, projectId);
    if (!project) throw notFound('Project');
    if (project.archived) throw new AppError(409, 'project_archived', 'That project is archived; restore it before adding captures');
    const sha256 = data ? await sha256OfFile(file.path, data.path) : (file.sha256 ?? (await sha256OfFile(file.path)));
    const existing = await findCaptureBySha(ctx.db, projectId, sha256);
    if (existing) return { id: existing.id, status: existing.status, duplicate: true };
    const name = fields.name || file.originalname.replace(/\.[^.]+$/, '') || 'Capture';
    let keptAs: number | null = null;
    const claimant = data ? null : (early?.claimant() ?? null);
    let claimed: ClaimedJob | null = null;
    try {
      const id = await ctx.db.transaction(async (tx) => {
        const [{ id }] = await tx
          .insert(captures)
          .values({
            projectId,
            name: name.slice(0, 200),
            uploadedBy: user.id,
            originalName: file.originalname.slice(0, 255),
            sha256,
            sizeBytes: file.size + (data?.size ?? 0),
            sampleRateHint: fields.sampleRate ?? null,
            channelSetup: fields.channelSetup ?? [],
            format: kind.format,
            dataName: data?.originalname.slice(0, 255) ?? null,
            comtradeValues: kind.format === 'comtrade' ? (fields.comtradeValues ?? 'primary') : null,
          })
          .$returningId();
        keptAs = id;
        const relative = await keepOriginal(ctx, file.path, id, kind.extension);
        const dataPath = data ? await keepOriginal(ctx, data.path, id, 'dat') : null;
        await tx.update(captures).set({ originalPath: relative, dataPath }).where(eq(captures.id, id));
        if (claimant) claimed = await enqueueClaimed(tx, id, claimant);
        else await enqueue(tx, id, 'ingest');
        return id;
      });
      if (claimed) early!.adopt(claimed);
      return { id, status: 'queued', duplicate: false };
    } catch (err) {
      // Rolled back after the file was moved: the capture id was never committed, so neither is its file.
      if (keptAs !== null) await removeCaptureFiles(ctx, keptAs);
      throw err;
    }
  } finally {
    await Promise.all([rm(file.path, { force: true }), data && rm(data.path, { force: true })]);
  }
}

export async function captureList(ctx: AppContext, user: User, q: CaptureListQuery): Promise<CaptureList> {
  const { items, total } = await listCaptures(ctx.db, q, user);
  return { items, total, page: q.page, pageSize: q.pageSize };
}

export async function captureDetail(ctx: AppContext, id: number): Promise<CaptureDetail> {
  const c = await findCaptureDetail(ctx.db, id);
  if (!c) throw notFound('Capture');
  return c;
}

export async function captureAnalysis(ctx: AppContext, id: number): Promise<AnalysisResponse> {
  const row = await findCaptureRow(ctx.db, id);
  if (!row) throw notFound('Capture');
  if (row.status !== 'ready') {
    throw new AppError(409, 'not_ready', row.status === 'failed' ? `The capture failed: ${row.errorMessage}` : `The capture is ${row.status}; its analysis is not ready yet`);
  }
  const { systems, voltageEvents } = await powerQualityOf(ctx.db, id);
  return { engineVersion: row.engineVersion ?? 0, channels: (await channelAnalyses(ctx.db, id)) as AnalysisResponse['channels'], systems, voltageEvents };
}

/** Only the uploader or an admin may change or delete a capture. */
export async function ownedCapture(ctx: AppContext, user: User, id: number) {
  const row = await findCaptureRow(ctx.db, id);
  if (!row) throw notFound('Capture');
  if (user.role !== 'admin' && row.uploadedBy !== user.id) throw forbidden('Only its uploader or an admin may change this capture');
  return row;
}

/**
 * Deletes the capture (samples, marks and jobs go with it by cascade), then its files, once that
 * committed. A delete during the storing of a run can meet it in a deadlock (the run's inserts hold
 * the capture row shared, then it updates the row); the delete is then simply run again.
 */
export async function deleteCapture(ctx: AppContext, user: User, id: number): Promise<void> {
  await ownedCapture(ctx, user, id);
  await retryOnDeadlock(() => ctx.db.delete(captures).where(eq(captures.id, id)));
  await removeCaptureFiles(ctx, id);
}

export async function updateCapture(ctx: AppContext, user: User, id: number, req: UpdateCaptureRequest): Promise<CaptureDetail> {
  await ownedCapture(ctx, user, id);
  await ctx.db.update(captures).set(req).where(eq(captures.id, id));
  return captureDetail(ctx, id);
}

/** A file without a time base failed asking for its sample rate: take it and process the file again. */
export async function provideSampleRate(ctx: AppContext, user: User, id: number, sampleRate: number): Promise<CaptureDetail> {
  const row = await ownedCapture(ctx, user, id);
  if (row.status !== 'failed') throw new AppError(409, 'not_failed', 'Only a failed capture can be given a sample rate');
  await ctx.db.transaction(async (tx) => {
    await tx.update(captures).set({ sampleRateHint: sampleRate, status: 'queued', errorCode: null, errorMessage: null, errorLine: null }).where(eq(captures.id, id));
    await enqueue(tx, id, 'ingest');
  });
  return captureDetail(ctx, id);
}

/**
 * Switches a COMTRADE capture between primary and secondary values: the record is read again, as a
 * re-analysis of a ready capture (which stays readable meanwhile) or a new ingest of a failed one.
 */
export async function setComtradeValues(ctx: AppContext, user: User, id: number, values: 'primary' | 'secondary'): Promise<CaptureDetail> {
  const row = await ownedCapture(ctx, user, id);
  if (row.format !== 'comtrade') throw new AppError(409, 'not_comtrade', 'Only a COMTRADE record has primary and secondary values');
  if (row.status === 'queued' || row.status === 'processing') throw new AppError(409, 'not_ready', 'The record is still being read; switch once it is ready');
  await ctx.db.transaction(async (tx) => {
    await tx.update(captures).set({ comtradeValues: values, ...(row.status === 'failed' ? { status: 'queued' as const, errorCode: null, errorMessage: null, errorLine: null } : {}) }).where(eq(captures.id, id));
    await enqueue(tx, id, row.status === 'failed' ? 'ingest' : 'reanalyse');
  });
  return captureDetail(ctx, id);
}

/** Queues every ready capture analysed by an older engine for re-analysis, once each; returns how many were queued. */
export async function reanalyseOutdated(ctx: AppContext): Promise<number> {
  const rows = await ctx.db.select({ id: captures.id, engineVersion: captures.engineVersion }).from(captures).where(eq(captures.status, 'ready'));
  let queued = 0;
  for (const r of rows) if ((r.engineVersion ?? 0) < ENGINE_VERSION && (await enqueue(ctx.db, r.id, 'reanalyse'))) queued++;
  return queued;
}
