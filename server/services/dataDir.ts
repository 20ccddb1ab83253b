import { chmod, mkdir, readdir, rm } from 'node:fs/promises';
import path from 'node:path';

/** Folders under DATA_DIR that hold only files of work in progress: uploads being received, originals unpacked for a reader. */
export const SCRATCH_DIRS = ['uploads', 'tmp'];

/**
 * Creates the data folder, or narrows an existing one, to mode 0700: it holds the session secret,
 * every uploaded original and (under `npm start`) the database's files, none of them for other users.
 */
export async function makePrivateDataDir(dataDir: string): Promise<void> {
  await mkdir(dataDir, { recursive: true, mode: 0o700 });
  await chmod(dataDir, 0o700);
}

/**
 * Removes what earlier runs left in the scratch folders (an upload cut short by a crash, an unpacked
 * copy whose reader died). Call it only while holding the data folder's lock: no other server then
 * works in this folder, so everything there is a leftover. Returns how many entries went.
 */
export async function sweepScratch(dataDir: string): Promise<number> {
  let removed = 0;
  for (const name of SCRATCH_DIRS) {
    const dir = path.join(dataDir, name);
    let entries: string[];
    try {
      entries = await readdir(dir);
    } catch (err) {
      if ((err as NodeJS.ErrnoException).code === 'ENOENT') continue;
      throw err;
    }
    for (const entry of entries) {
      await rm(path.join(dir, entry), { recursive: true, force: true });
      removed++;
    }
  }
  return removed;
}
