import { createHash } from 'node:crypto';
import { createReadStream, createWriteStream } from 'node:fs';
import { mkdir, rename, rm } from 'node:fs/promises';
import path from 'node:path';
import { pipeline } from 'node:stream/promises';
import { createGunzip, createGzip } from 'node:zlib';
import { eq } from 'drizzle-orm';
import type { AppContext } from '../context';
import { captures } from '../db/schema';

export const ORIGINALS_DIR = 'originals';

export async function sha256OfFile(file: string): Promise<string> {
  const hash = createHash('sha256');
  await pipeline(createReadStream(file), hash);
  return hash.digest('hex');
}

/** Moves an upload into the originals folder; returns its path relative to DATA_DIR. */
export async function keepOriginal(ctx: AppContext, tempFile: string, captureId: number): Promise<string> {
  const relative = path.join(ORIGINALS_DIR, `${captureId}.csv`);
  await mkdir(path.join(ctx.config.DATA_DIR, ORIGINALS_DIR), { recursive: true });
  await rename(tempFile, path.join(ctx.config.DATA_DIR, relative));
  return relative;
}

/**
 * Gzips the kept original once its capture is ready (zlib works on libuv's thread pool, off the event
 * loop), then points the capture at the compressed file. Instrument CSVs shrink about five- to ten-fold.
 */
export async function compressOriginal(ctx: AppContext, captureId: number): Promise<void> {
  const [row] = await ctx.db.select({ originalPath: captures.originalPath }).from(captures).where(eq(captures.id, captureId));
  if (!row?.originalPath || row.originalPath.endsWith('.gz')) return;
  const source = path.join(ctx.config.DATA_DIR, row.originalPath);
  const target = `${row.originalPath}.gz`;
  await pipeline(createReadStream(source), createGzip({ level: 6 }), createWriteStream(path.join(ctx.config.DATA_DIR, target)));
  await ctx.db.update(captures).set({ originalPath: target }).where(eq(captures.id, captureId));
  await rm(source, { force: true });
}

export async function removeOriginal(ctx: AppContext, relative: string | null): Promise<void> {
  if (relative) await rm(path.join(ctx.config.DATA_DIR, relative), { force: true });
}

/** A plain-text copy of the original for the reader: the file itself, or a gunzipped temporary copy. */
export async function readableOriginal(ctx: AppContext, relative: string): Promise<{ file: string; done(): Promise<void> }> {
  const file = path.join(ctx.config.DATA_DIR, relative);
  if (!relative.endsWith('.gz')) return { file, done: async () => undefined };
  const tmpDir = path.join(ctx.config.DATA_DIR, 'tmp');
  await mkdir(tmpDir, { recursive: true });
  const tmp = path.join(tmpDir, `${path.basename(relative, '.gz')}-${process.pid}-${Date.now()}`);
  await pipeline(createReadStream(file), createGunzip(), createWriteStream(tmp));
  return { file: tmp, done: () => rm(tmp, { force: true }) };
}

/** The original as a stream of its text, whether kept plain or compressed. */
export function originalStream(ctx: AppContext, relative: string): NodeJS.ReadableStream {
  const raw = createReadStream(path.join(ctx.config.DATA_DIR, relative));
  return relative.endsWith('.gz') ? raw.pipe(createGunzip()) : raw;
}
