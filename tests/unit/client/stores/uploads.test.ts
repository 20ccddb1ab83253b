import { createPinia, setActivePinia } from 'pinia';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import type { CaptureDetail } from '../../../../shared/schemas/capture';
import * as capturesApi from '../../../../src/api/captures';
import { ApiError } from '../../../../src/api/http';
import { useUploadsStore } from '../../../../src/stores/uploads';

vi.mock('../../../../src/api/captures');
const file = (name: string) => new File(['Time (s),CH1 (V)\n0,1\n'], name);

beforeEach(() => {
  setActivePinia(createPinia());
  vi.useFakeTimers();
});
afterEach(() => {
  vi.useRealTimers();
  vi.resetAllMocks();
});

describe('the uploads store', () => {
  it('follows an upload through its progress and processing until it is ready, then tells who listens', async () => {
    vi.mocked(capturesApi.uploadCapture).mockImplementation(async (_f, _fields, progress) => {
      progress(0.5);
      return { id: 11, status: 'queued', duplicate: false };
    });
    const states = ['processing', 'ready'];
    vi.mocked(capturesApi.getCapture).mockImplementation(async () => ({ status: states.shift(), error: null }) as CaptureDetail);
    const uploads = useUploadsStore();
    const settled = vi.fn();
    uploads.onSettled(settled);
    await uploads.add([file('mains.csv')], 3);
    expect(uploads.items[0]).toMatchObject({ fileName: 'mains.csv', projectId: 3, captureId: 11, status: 'queued', progress: 1 });
    await vi.runAllTimersAsync();
    expect(uploads.items[0].status).toBe('ready');
    expect(settled).toHaveBeenCalledWith(expect.objectContaining({ captureId: 11, status: 'ready' }));
  });

  it('says when a file was uploaded before', async () => {
    vi.mocked(capturesApi.uploadCapture).mockResolvedValue({ id: 4, status: 'ready', duplicate: true });
    const uploads = useUploadsStore();
    await uploads.add([file('again.csv')], 3);
    await vi.runAllTimersAsync();
    expect(uploads.items[0]).toMatchObject({ duplicate: true, message: 'Already uploaded: this is the existing capture' });
  });

  it('shows the reason a file failed, with its line', async () => {
    vi.mocked(capturesApi.uploadCapture).mockResolvedValue({ id: 5, status: 'queued', duplicate: false });
    vi.mocked(capturesApi.getCapture).mockResolvedValue({ status: 'failed', error: { code: 'invalid_csv', message: 'No numbers in column 2', line: 7 } } as CaptureDetail);
    const uploads = useUploadsStore();
    await uploads.add([file('bad.csv')], 3);
    await vi.runAllTimersAsync();
    expect(uploads.items[0]).toMatchObject({ status: 'failed', message: 'No numbers in column 2 (line 7)' });
  });

  it('an upload the server refuses fails with its message, and can be dismissed', async () => {
    vi.mocked(capturesApi.uploadCapture).mockRejectedValue(new ApiError(413, 'too_large', 'The file is larger than 200 MB'));
    const uploads = useUploadsStore();
    await uploads.add([file('huge.csv')], 3);
    await vi.runAllTimersAsync();
    expect(uploads.items[0]).toMatchObject({ status: 'failed', message: 'The file is larger than 200 MB' });
    uploads.dismiss(uploads.items[0].key);
    expect(uploads.items).toEqual([]);
  });
});
