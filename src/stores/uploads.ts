import { defineStore } from 'pinia';
import { ref } from 'vue';
import type { CaptureStatus } from '../../shared/schemas/capture';
import { uploadCapture } from '../api/captures';
import { isApiError } from '../api/http';
import { isSettled, useCaptureStatusStore } from './captureStatus';
import { uploadGroups } from './uploadGroups';

export interface UploadItem {
  key: number;
  fileName: string;
  projectId: number;
  progress: number;
  captureId: number | null;
  status: 'uploading' | CaptureStatus;
  duplicate: boolean;
  message: string;
}

/**
 * Uploads in flight and their processing status, shared by every view that shows them; the statuses come
 * from the one capture status poller, and outlive the page an upload started on.
 */
export const useUploadsStore = defineStore('uploads', () => {
  const statuses = useCaptureStatusStore();
  const items = ref<UploadItem[]>([]);
  let nextKey = 1;
  const listeners = new Set<(item: UploadItem) => void>();

  /** Called whenever an upload reaches ready or failed. */
  function onSettled(fn: (item: UploadItem) => void) {
    listeners.add(fn);
    return () => listeners.delete(fn);
  }

  /** Called when an upload has its capture id (the capture now exists, in the queue). */
  const addedListeners = new Set<(item: UploadItem) => void>();
  function onAdded(fn: (item: UploadItem) => void) {
    addedListeners.add(fn);
    return () => addedListeners.delete(fn);
  }

  function follow(item: UploadItem) {
    const settle = () => listeners.forEach((fn) => fn(item));
    if (!item.captureId || (item.status !== 'queued' && item.status !== 'processing')) return settle();
    const stop = statuses.follow(item.captureId, (answer) => {
      if ('capture' in answer) {
        const c = answer.capture;
        item.status = c.status;
        // A COMTRADE message names its file and line itself.
        item.message = c.error ? `${c.error.message}${c.error.line && !c.error.message.includes(`line ${c.error.line}`) ? ` (line ${c.error.line})` : ''}` : item.message;
        if (!isSettled(c)) return;
      } else {
        item.status = 'failed';
        item.message = isApiError(answer.error) ? answer.error.message : String(answer.error);
      }
      stop();
      settle();
    });
  }

  /** `channelSetup`: JSON of setups applied from the first analysis on (a probe preset chosen at upload). */
  async function add(files: File[], projectId: number, channelSetup?: string) {
    for (const { file, data, refused, note } of uploadGroups(files)) {
      const fileName = data ? `${file.name} + ${data.name}` : file.name;
      const item = ref<UploadItem>({ key: nextKey++, fileName, projectId, progress: 0, captureId: null, status: refused ? 'failed' : 'uploading', duplicate: false, message: refused ?? note ?? '' }).value;
      items.value.unshift(item);
      if (refused) continue;
      const tracked = items.value[0];
      uploadCapture(file, { projectId, channelSetup, data }, (f) => (tracked.progress = f))
        .then((r) => {
          tracked.progress = 1;
          tracked.captureId = r.id;
          tracked.status = r.status;
          tracked.duplicate = r.duplicate;
          if (r.duplicate) tracked.message = 'Already uploaded: this is the existing capture';
          addedListeners.forEach((fn) => fn(tracked));
          follow(tracked);
        })
        .catch((e) => {
          tracked.status = 'failed';
          tracked.message = isApiError(e) ? e.message : String(e);
          listeners.forEach((fn) => fn(tracked));
        });
    }
  }

  function dismiss(key: number) {
    items.value = items.value.filter((i) => i.key !== key);
  }

  return { items, add, dismiss, onSettled, onAdded };
});
