import { createHash, randomBytes } from 'node:crypto';
import { createWriteStream } from 'node:fs';
import { rm } from 'node:fs/promises';
import path from 'node:path';
import { pipeline } from 'node:stream/promises';
import type { Request } from 'express';
import type { StorageEngine } from 'multer';

/** What the storage adds to multer's file: the SHA-256 of the bytes, taken as they arrived. */
export interface HashedFile {
  path: string;
  size: number;
  sha256: string;
}

/** Who else sees the bytes of a file as they arrive (the reading of an upload), if anyone. */
export type FileTap = (req: Request, file: Express.Multer.File) => ((chunk: Buffer) => void) | null;

/**
 * multer storage that writes an upload to `dir` (0600) and hashes it on the way, so the duplicate check
 * needs no second read of the file: on the 27 MB bench file that second read cost about 0.1 s. `tap`
 * may hand each chunk on as well, in the same pass.
 */
export function hashingDiskStorage(dir: string, tap?: FileTap): StorageEngine {
  return {
    _handleFile(req, file, cb) {
      const target = path.join(dir, randomBytes(16).toString('hex'));
      const hash = createHash('sha256');
      const also = tap?.(req, file) ?? null;
      let size = 0;
      file.stream.on('data', (chunk: Buffer) => {
        hash.update(chunk);
        also?.(chunk);
        size += chunk.length;
      });
      pipeline(file.stream, createWriteStream(target, { mode: 0o600 })).then(
        // multer copies every property given here onto req.file.
        () => cb(null, { path: target, size, sha256: hash.digest('hex') } satisfies HashedFile as Partial<Express.Multer.File>),
        (err: Error) => void rm(target, { force: true }).finally(() => cb(err)),
      );
    },
    _removeFile(_req, file, cb) {
      rm(file.path, { force: true }).then(() => cb(null), cb);
    },
  };
}
