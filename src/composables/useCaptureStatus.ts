import { onScopeDispose } from 'vue';
import type { CaptureDetail } from '../../shared/schemas/capture';
import { isSettled, useCaptureStatusStore } from '../stores/captureStatus';

/**
 * A page's view of the one status poller: `follow(id, onChange, onSettled)` hears the capture until it
 * is ready or failed (and not analysing again), or until asking fails; everything the page follows
 * stops when it unmounts.
 */
export function useCaptureStatus() {
  const store = useCaptureStatusStore();
  const stops = new Map<number, () => void>();

  function unfollow(id: number) {
    stops.get(id)?.();
    stops.delete(id);
  }
  function follow(id: number, on: { settled: (c: CaptureDetail) => void; change?: (c: CaptureDetail) => void; error?: (e: unknown) => void }) {
    unfollow(id);
    stops.set(
      id,
      store.follow(id, (answer) => {
        if (!('capture' in answer)) {
          unfollow(id);
          return on.error?.(answer.error);
        }
        on.change?.(answer.capture);
        if (!isSettled(answer.capture)) return;
        unfollow(id);
        on.settled(answer.capture);
      }),
    );
  }
  const stopAll = () => [...stops.keys()].forEach(unfollow);
  onScopeDispose(stopAll);
  return { follow, unfollow, stopAll, following: () => [...stops.keys()] };
}
