import { defineStore } from 'pinia';
import { ref } from 'vue';
import type { CaptureStatus } from '../../shared/schemas/capture';
import { getCapture, uploadCapture } from '../api/captures';
import { isApiError } from '../api/http';

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

const POLL_MS = 700;

/** Uploads in flight and their processing status, shared by every view that shows them. */
export const useUploadsStore = defineStore('uploads', () => {
  const items = ref<UploadItem[]>([]);
  let nextKey = 1;
  const listeners = new Set<(item: UploadItem) => void>();

  /** Called whenever an upload reaches ready or failed. */
  function onSettled(fn: (item: UploadItem) => void) {
    listeners.add(fn);
    return () => listeners.delete(fn);
  }

  async function follow(item: UploadItem) {
    while (item.captureId && (item.status === 'queued' || item.status === 'processing')) {
      await new Promise((r) => setTimeout(r, POLL_MS));
      try {
        const c = await getCapture(item.captureId);
        item.status = c.status;
        item.message = c.error ? `${c.error.message}${c.error.line ? ` (line ${c.error.line})` : ''}` : '';
      } catch (e) {
        item.status = 'failed';
        item.message = isApiError(e) ? e.message : String(e);
      }
    }
    listeners.forEach((fn) => fn(item));
  }

  /** `channelSetup`: JSON of setups applied from the first analysis on (a probe preset chosen at upload). */
  async function add(files: File[], projectId: number, channelSetup?: string) {
    for (const file of files) {
      const item = ref<UploadItem>({ key: nextKey++, fileName: file.name, projectId, progress: 0, captureId: null, status: 'uploading', duplicate: false, message: '' }).value;
      items.value.unshift(item);
      const tracked = items.value[0];
      uploadCapture(file, { projectId, channelSetup }, (f) => (tracked.progress = f))
        .then((r) => {
          tracked.progress = 1;
          tracked.captureId = r.id;
          tracked.status = r.status;
          tracked.duplicate = r.duplicate;
          if (r.duplicate) tracked.message = 'Already uploaded: this is the existing capture';
          return follow(tracked);
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

  return { items, add, dismiss, onSettled };
});
