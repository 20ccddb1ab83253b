import { existsSync, readFileSync } from 'node:fs';
import { link, readFile, rename, rm, writeFile } from 'node:fs/promises';
import path from 'node:path';
import { StartupError } from '../startupError';

/** The server that holds a data folder: its pid, its process start time and its address. */
export interface LockHolder {
  pid: number;
  /** Start time of the process in clock ticks since boot ('' where /proc is missing). */
  started: string;
  /** Its address, or 'starting' until it listens. */
  url: string;
}

export interface DataDirLock {
  /** Records the address once the server listens, for the message a second start prints. */
  setUrl(url: string): Promise<void>;
  /** Removes the lock if it is still this process's. */
  release(): Promise<void>;
}

export const LOCK_FILE = 'server.lock';

/** Fields 3 (state) and 22 (start time, in clock ticks since boot) of /proc/PID/stat; null where there is none. */
function procStat(pid: number): { state: string; started: string } | null {
  try {
    const stat = readFileSync(`/proc/${pid}/stat`, 'utf8');
    // The command name (field 2) is in parentheses and may hold spaces; count fields after it.
    const fields = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
    return { state: fields[0], started: fields[19] ?? '' };
  } catch {
    return null;
  }
}

/**
 * A pid alone cannot tell a live holder from a dead one whose pid was handed to another process; the
 * pid with the process's start time can. Null where /proc is missing.
 */
export function processStart(pid: number): string | null {
  return procStat(pid)?.started ?? null;
}

export function isAlive(holder: LockHolder): boolean {
  if (!existsSync('/proc/self/stat')) {
    try {
      process.kill(holder.pid, 0);
      return true;
    } catch (err) {
      // EPERM: the process exists but belongs to another user.
      return (err as NodeJS.ErrnoException).code === 'EPERM';
    }
  }
  const stat = procStat(holder.pid);
  // A zombie (killed, its parent gone, not yet reaped by init) has exited and holds nothing.
  if (!stat || stat.state === 'Z' || stat.state === 'X') return false;
  return holder.started === '' || stat.started === holder.started;
}

const format = (h: LockHolder) => `pid=${h.pid}\nstarted=${h.started}\nurl=${h.url}\n`;

export function parseLock(text: string): LockHolder | null {
  const field = (key: string) => new RegExp(`^${key}=(.*)$`, 'm').exec(text)?.[1] ?? '';
  const pid = Number(field('pid'));
  if (!Number.isInteger(pid) || pid <= 0) return null;
  return { pid, started: field('started'), url: field('url') || 'starting' };
}

/** The two lines a second start prints; scripts/lib.sh prints the same for the scripts' own lock. */
export function alreadyRunning(dataDir: string, holder: LockHolder): string {
  const where = holder.url === 'starting' ? 'still starting' : holder.url;
  return (
    `Crestline is already running from this folder (${path.resolve(dataDir)}): pid ${holder.pid}, ${where}\n` +
    `Stop that one first (Ctrl-C in its terminal, or kill ${holder.pid}), or give this one its own DATA_DIR.`
  );
}

/**
 * Makes this process the one server of a data folder: DATA_DIR/server.lock names it. A lock whose
 * holder is gone (killed with SIGKILL, a power cut) is taken over, so it never blocks the next start;
 * a live holder makes the start fail with a StartupError naming it.
 *
 * The file is created whole with link(2), which fails if it exists, and rewritten with rename(2), so
 * a reader never sees it half-written and never mistakes a fresh lock for a broken one.
 */
export async function lockDataDir(dataDir: string): Promise<DataDirLock> {
  const file = path.join(dataDir, LOCK_FILE);
  const me: LockHolder = { pid: process.pid, started: processStart(process.pid) ?? '', url: 'starting' };
  const scratch = `${file}.${process.pid}`;
  const write = async (holder: LockHolder) => {
    await writeFile(scratch, format(holder), { mode: 0o600 });
  };
  await write(me);
  try {
    // Three rounds: a stale lock is removed in one and taken in the next; a third covers a race with
    // another start doing the same.
    for (let round = 0; round < 3; round++) {
      try {
        await link(scratch, file);
        // Unlinked now so that setUrl writes a new file rather than the inode the lock shares with it.
        await rm(scratch, { force: true });
        return {
          setUrl: async (url) => {
            me.url = url;
            await write(me);
            await rename(scratch, file);
          },
          release: async () => {
            const holder = parseLock(await readFile(file, 'utf8').catch(() => ''));
            if (holder?.pid === me.pid && holder.started === me.started) await rm(file, { force: true });
          },
        };
      } catch (err) {
        if ((err as NodeJS.ErrnoException).code !== 'EEXIST') throw err;
      }
      const text = await readFile(file, 'utf8').catch(() => null);
      if (text === null) continue;
      const holder = parseLock(text);
      if (holder && isAlive(holder)) throw new StartupError(alreadyRunning(dataDir, holder));
      // Left by a server that died. Remove it only if no other start has replaced it meanwhile.
      if ((await readFile(file, 'utf8').catch(() => null)) === text) await rm(file, { force: true });
    }
    throw new StartupError(`Crestline cannot start: ${file} keeps changing; is another server starting from this folder?`);
  } catch (err) {
    await rm(scratch, { force: true });
    throw err;
  }
}
