import { defineStore } from 'pinia';
import type { CaptureDetail } from '../../shared/schemas/capture';
import { getCapture } from '../api/captures';

/** What a follower hears on each poll: the capture as it is now, or why asking failed. */
export type StatusListener = (answer: { capture: CaptureDetail } | { error: unknown }) => void;

export const STATUS_POLL_MS = 800;

/** A capture is still changing while it is queued, processing or being analysed again. */
export const isSettled = (c: CaptureDetail) => (c.status === 'ready' || c.status === 'failed') && !c.reanalysing;

/**
 * The one status poller of the app: every view and the uploads queue follow captures through it, so a
 * capture is asked for once per tick however many follow it, and the timer runs only while someone does.
 */
export const useCaptureStatusStore = defineStore('captureStatus', () => {
  const followers = new Map<number, Set<StatusListener>>();
  let timer: ReturnType<typeof setTimeout> | undefined;

  async function tick() {
    timer = undefined;
    await Promise.all(
      [...followers.keys()].map(async (id) => {
        const answer = await getCapture(id).then((capture) => ({ capture }), (error: unknown) => ({ error }));
        followers.get(id)?.forEach((fn) => fn(answer));
      }),
    );
    schedule();
  }
  function schedule() {
    if (timer === undefined && followers.size > 0) timer = setTimeout(() => void tick(), STATUS_POLL_MS);
  }

  /** Hears the capture's status on every tick until the returned function is called. */
  function follow(id: number, fn: StatusListener): () => void {
    const set = followers.get(id) ?? new Set();
    set.add(fn);
    followers.set(id, set);
    schedule();
    return () => {
      set.delete(fn);
      if (set.size === 0 && followers.get(id) === set) followers.delete(id);
      if (followers.size === 0 && timer !== undefined) {
        clearTimeout(timer);
        timer = undefined;
      }
    };
  }

  /** The ids followed now. */
  const followed = () => [...followers.keys()];

  return { follow, followed };
});
