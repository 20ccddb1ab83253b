// @vitest-environment happy-dom
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import type { CaptureDetail } from '../../../../shared/schemas/capture';
import * as capturesApi from '../../../../src/api/captures';
import { useCaptureStatus } from '../../../../src/composables/useCaptureStatus';
import { STATUS_POLL_MS, useCaptureStatusStore } from '../../../../src/stores/captureStatus';
import { useUploadsStore } from '../../../../src/stores/uploads';
import { withSetup } from '../harness';

vi.mock('../../../../src/api/captures');
const capture = (status: CaptureDetail['status'], reanalysing = false) => ({ id: 7, status, reanalysing, error: null }) as unknown as CaptureDetail;

beforeEach(() => vi.useFakeTimers());
afterEach(() => {
  vi.useRealTimers();
  vi.resetAllMocks();
});

describe('useCaptureStatusStore', () => {
  it('asks once per tick for a capture however many follow it, and stops its timer when nobody does', async () => {
    const { wrapper } = withSetup(() => null);
    const timersBefore = vi.getTimerCount(); // the first mount leaves one of the DOM's own
    vi.mocked(capturesApi.getCapture).mockResolvedValue(capture('processing'));
    const store = useCaptureStatusStore();
    const a = vi.fn();
    const b = vi.fn();
    const stopA = store.follow(7, a);
    const stopB = store.follow(7, b);
    await vi.advanceTimersByTimeAsync(STATUS_POLL_MS);
    expect(capturesApi.getCapture).toHaveBeenCalledTimes(1);
    expect(a).toHaveBeenCalledWith({ capture: capture('processing') });
    expect(b).toHaveBeenCalledTimes(1);
    stopA();
    stopB();
    expect(store.followed()).toEqual([]);
    expect(vi.getTimerCount()).toBe(timersBefore);
    wrapper.unmount();
  });
});

describe('useCaptureStatus', () => {
  it('tells the page when a capture being analysed again is done, then stops asking', async () => {
    const answers = [capture('ready', true), capture('ready')];
    vi.mocked(capturesApi.getCapture).mockImplementation(async () => answers.shift() ?? capture('ready'));
    const { result, wrapper } = withSetup(() => useCaptureStatus());
    const settled = vi.fn();
    const change = vi.fn();
    result.follow(7, { settled, change });
    await vi.advanceTimersByTimeAsync(STATUS_POLL_MS);
    expect(settled).not.toHaveBeenCalled();
    await vi.advanceTimersByTimeAsync(STATUS_POLL_MS);
    expect(settled).toHaveBeenCalledWith(capture('ready'));
    expect(change).toHaveBeenCalledTimes(2);
    expect(result.following()).toEqual([]);
    expect(useCaptureStatusStore().followed()).toEqual([]);
    wrapper.unmount();
  });

  it('stops everything the page followed when the page unmounts', async () => {
    vi.mocked(capturesApi.getCapture).mockResolvedValue(capture('queued'));
    const { result, wrapper } = withSetup(() => useCaptureStatus());
    result.follow(7, { settled: vi.fn() });
    result.follow(8, { settled: vi.fn() });
    expect(useCaptureStatusStore().followed()).toEqual([7, 8]);
    wrapper.unmount();
    expect(useCaptureStatusStore().followed()).toEqual([]);
    await vi.advanceTimersByTimeAsync(5 * STATUS_POLL_MS);
    expect(capturesApi.getCapture).not.toHaveBeenCalled();
  });

  it('shares the poller with the uploads queue: a page and an upload of the same capture cost one request a tick', async () => {
    vi.mocked(capturesApi.uploadCapture).mockResolvedValue({ id: 7, status: 'queued', duplicate: false });
    vi.mocked(capturesApi.getCapture).mockResolvedValue(capture('processing'));
    const { result, wrapper } = withSetup(() => useCaptureStatus());
    await useUploadsStore().add([new File(['t,v\n0,1\n'], 'a.csv')], 1);
    await vi.advanceTimersByTimeAsync(0);
    result.follow(7, { settled: vi.fn() });
    await vi.advanceTimersByTimeAsync(STATUS_POLL_MS);
    expect(capturesApi.getCapture).toHaveBeenCalledTimes(1);
    wrapper.unmount();
  });
});
