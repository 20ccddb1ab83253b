import { and, eq, getTableName, sql } from 'drizzle-orm';
import { blobTransaction, type BlobWriter } from '../db/blobTransaction';
import { retryOnDeadlock } from '../db/retryOnDeadlock';
import type { Db, DbOrTx } from '../db/client';
import { annotations, captures, channels, jobs, overviews, sampleChunks } from '../db/schema';
import type { IngestResult } from '../workers/ingestTask';
import { ownedBy, type ClaimedJob } from './jobQueue';
import { shortMessage } from './processingFailure';


// The blob-carrying inserts, sent prepared (see blobTransaction). The names are those of schema.ts.
const INSERT_CHUNK = `INSERT INTO ${getTableName(sampleChunks)} (capture_id, channel_idx, chunk_idx, start_index, count, data) VALUES (?, ?, ?, ?, ?, ?)`;
const INSERT_OVERVIEW = `INSERT INTO ${getTableName(overviews)} (capture_id, channel_idx, bucket_size, data) VALUES (?, ?, ?, ?)`;

const asBuffer = (u: Uint8Array) => Buffer.from(u.buffer, u.byteOffset, u.byteLength);

const holdsRows = async (tx: DbOrTx, table: typeof sampleChunks | typeof channels, captureId: number) =>
  (await tx.select({ one: sql<number>`1` }).from(table).where(eq(table.captureId, captureId)).limit(1)).length > 0;

/**
 * Removes what an earlier run stored for a capture (a retry, a re-analysis), samples included or not.
 * Only when there is something: a DELETE over an empty range takes gap locks that deadlock with other
 * captures' inserts.
 */
async function clearStoredResults(tx: DbOrTx, captureId: number, withSamples: boolean): Promise<void> {
  if (withSamples && (await holdsRows(tx, sampleChunks, captureId))) await tx.delete(sampleChunks).where(eq(sampleChunks.captureId, captureId));
  if (!(await holdsRows(tx, channels, captureId))) return;
  for (const table of [overviews, channels]) await tx.delete(table).where(eq(table.captureId, captureId));
  // Suggestions not yet acted on are replaced by the new run's; accepted or dismissed ones stay.
  await tx.delete(annotations).where(and(eq(annotations.captureId, captureId), eq(annotations.source, 'finder'), eq(annotations.state, 'suggested')));
}

async function writeChunks(writeBlobs: BlobWriter, captureId: number, stored: Uint8Array[][]): Promise<void> {
  for (const [idx, chunks] of stored.entries()) {
    let start = 0;
    for (const [chunkIdx, data] of chunks.entries()) {
      const buf = asBuffer(data);
      await writeBlobs(INSERT_CHUNK, [captureId, idx, chunkIdx, start, buf.length / 4, buf]);
      start += buf.length / 4;
    }
  }
}

/**
 * Stores the samples of an ingest while its channels are still being analysed, in a short transaction
 * of its own: on the 1 M-row bench file this takes the 30–90 ms of the sample blobs off the time to
 * ready. Nothing reads them before storeReady marks the capture ready, and storeFailure removes them.
 * Not for a re-analysis: its capture stays readable meanwhile, and its samples and figures must change
 * together. The capture row is locked first, then the job's (the order of storeReady and of a delete),
 * and only while the job still belongs to this claim: a claim that lost its job can neither overwrite
 * the new owner's samples nor leave its own behind it.
 */
export function storeSamples(db: Db, job: ClaimedJob, stored: Uint8Array[][]): Promise<void> {
  return retryOnDeadlock(() =>
    blobTransaction(db, async (tx, writeBlobs) => {
      await tx.select({ id: captures.id }).from(captures).where(eq(captures.id, job.captureId)).for('update');
      const [owned] = await tx.update(jobs).set({ heartbeatAt: sql`NOW()` }).where(ownedBy(job));
      if (owned.affectedRows !== 1) throw new Error(`job ${job.id} was taken over by another worker`);
      await clearStoredResults(tx, job.captureId, true);
      await writeChunks(writeBlobs, job.captureId, stored);
    }),
  );
}

/**
 * Stores a finished run in one transaction: samples, channels, pyramid, finder suggestions, and the
 * capture marked ready, on condition that the job still belongs to this claim (else all is rolled back).
 * `stored` holds each channel's samples as Float32 chunks, packed by the worker that read the file, or
 * is null when storeSamples has stored them already.
 * The transaction starts only once the analysis is done: opened beside it, it held the capture row for
 * as long as the analysis ran, up to its time budget, and a delete or a database reset waited on it past
 * MariaDB's 50 s lock timeout. (storeSamples, beside the analysis, is a short transaction of its own.)
 */
export function storeReady(db: Db, job: ClaimedJob, stored: Uint8Array[][] | null, r: IngestResult): Promise<void> {
  return retryOnDeadlock(() =>
    blobTransaction(db, async (tx, writeBlobs) => {
      // The capture row is locked first: the inserts below would take it shared (foreign keys) and the
      // final update exclusive, and a user's change or delete of the capture in between would then end
      // in a deadlock. Locked first, such a change waits for this store instead.
      await tx.select({ id: captures.id }).from(captures).where(eq(captures.id, job.captureId)).for('update');
      await clearStoredResults(tx, job.captureId, stored !== null);
      if (stored) await writeChunks(writeBlobs, job.captureId, stored);
      const [done] = await tx.update(jobs).set({ status: 'done', finishedAt: sql`NOW()` }).where(ownedBy(job));
      if (done.affectedRows !== 1) throw new Error(`job ${job.id} was taken over by another worker`);
      for (const [idx, c] of r.channels.entries()) {
        await tx.insert(channels).values({ captureId: job.captureId, idx, name: c.name.slice(0, 120), unit: c.unit.slice(0, 20), invalidCount: c.invalidCount, analysis: c.analysis });
        for (const o of c.overviews) await writeBlobs(INSERT_OVERVIEW, [job.captureId, idx, o.bucketSize, asBuffer(o.data)]);
        if (c.suggestions.length) {
          await tx.insert(annotations).values(
            c.suggestions.map((a) => ({ captureId: job.captureId, channelIdx: idx, startS: a.startS, endS: a.endS, label: a.label, note: '', severity: a.severity, source: 'finder' as const, state: 'suggested' as const, reason: a.reason })),
          );
        }
      }
      // Marks the file itself sets (a COMTRADE trigger) belong to no one channel. One already accepted
      // or dismissed in an earlier run is left as the user made it, not suggested again.
      const kept = r.marks?.length ? await tx.select({ label: annotations.label, startS: annotations.startS }).from(annotations).where(and(eq(annotations.captureId, job.captureId), eq(annotations.source, 'finder'))) : [];
      const marks = (r.marks ?? []).filter((m) => !kept.some((k) => k.label === m.label && k.startS === m.startS));
      if (marks.length) {
        await tx.insert(annotations).values(marks.map((m) => ({ captureId: job.captureId, channelIdx: null, ...m, note: '', source: 'finder' as const, state: 'suggested' as const })));
      }
      await tx
        .update(captures)
        .set({
          status: 'ready',
          errorCode: null,
          errorMessage: null,
          errorLine: null,
          sampleRate: r.sampleRate,
          sampleCount: r.sampleCount,
          t0: r.t0,
          detected: r.detected,
          metadata: r.metadata,
          comtrade: r.comtrade ?? null,
          engineVersion: r.engineVersion,
          powerQuality: { systems: r.systems, voltageEvents: r.channels.flatMap((c, channel) => (c.voltageEvents ? [{ channel, ...c.voltageEvents }] : [])) },
          readyAt: sql`NOW()`,
        })
        .where(eq(captures.id, job.captureId));
    }),
  );
}

/**
 * Ends a job that cannot succeed. An ingest leaves its capture failed with the (short) message and no
 * samples; a re-analysis leaves the capture as it was, ready with its last good results.
 */
export function storeFailure(db: Db, job: ClaimedJob, failure: { code: string; message: string; line?: number }): Promise<void> {
  const message = shortMessage(failure.message);
  return retryOnDeadlock(() =>
    db.transaction(async (tx) => {
      // The capture row first, as storeSamples, storeReady and a delete take it, so none of them deadlocks with this.
      await tx.select({ id: captures.id }).from(captures).where(eq(captures.id, job.captureId)).for('update');
      const [owned] = await tx.update(jobs).set({ status: 'failed', lastError: message, finishedAt: sql`NOW()` }).where(ownedBy(job));
      if (owned.affectedRows !== 1 || job.kind === 'reanalyse') return;
      await clearStoredResults(tx, job.captureId, true);
      await tx.update(captures).set({ status: 'failed', errorCode: failure.code.slice(0, 40), errorMessage: message, errorLine: failure.line ?? null }).where(eq(captures.id, job.captureId));
    }),
  );
}
