import { afterEach, describe, expect, it, vi } from 'vitest';
import { CLIENT_HEADER, CLIENT_HEADER_VALUE } from '../../../../shared/clientHeader';
import { encodeSamplesBinary, SAMPLES_BINARY_TYPE, samplesToJson, type SampleWindowData } from '../../../../shared/samples/samplesBinary';
import { getSamples } from '../../../../src/api/captures';
import { sharedSamples } from '../../../../src/api/shares';
import { samplesSeries } from '../../../../src/charts/samplesSeries';

// Values a Float32 holds exactly, so the binary and JSON answers carry the same numbers; NaN is a gap.
const raw: SampleWindowData = { channel: 1, mode: 'raw', t0S: 0.25, stepS: 0.5, startIndex: 4, sampleCount: 4, values: Float32Array.of(1.5, NaN, -3.25, 0) };
const minmax: SampleWindowData = { channel: 0, mode: 'minmax', t0S: 0, stepS: 0.125, startIndex: 0, sampleCount: 64, min: Float32Array.of(-2, NaN), max: Float32Array.of(2, NaN) };

/** The server as the samples route answers an `Accept: application/octet-stream` request. */
function serveBinary(w: SampleWindowData) {
  const body = encodeSamplesBinary(w);
  const fetchMock = vi.fn(async () => new Response(body.buffer as ArrayBuffer, { status: 200, headers: { 'content-type': SAMPLES_BINARY_TYPE } }));
  vi.stubGlobal('fetch', fetchMock);
  return fetchMock;
}

afterEach(() => vi.unstubAllGlobals());

describe('getSamples', () => {
  it('raw samples: asks for the binary answer with the client header and feeds the chart the same series as JSON', async () => {
    const fetchMock = serveBinary(raw);
    const answer = await getSamples(9, { channel: 1, fromS: 0, toS: 2, points: 2000 });
    expect(answer).toEqual(samplesToJson(raw));
    expect(samplesSeries(answer)).toEqual(samplesSeries(samplesToJson(raw)));
    const [url, init] = fetchMock.mock.calls[0] as unknown as [string, RequestInit];
    expect(url).toBe('/api/captures/9/samples?channel=1&fromS=0&toS=2&points=2000');
    expect(init.headers).toMatchObject({ accept: SAMPLES_BINARY_TYPE, [CLIENT_HEADER]: CLIENT_HEADER_VALUE });
  });

  it('min/max buckets: keeps the union on mode, with empty buckets as null', async () => {
    serveBinary(minmax);
    const answer = await getSamples(9, { channel: 0, points: 2 });
    expect(answer).toEqual({ channel: 0, mode: 'minmax', t0S: 0, stepS: 0.125, startIndex: 0, sampleCount: 64, min: [-2, null], max: [2, null] });
    expect(samplesSeries(answer)).toEqual(samplesSeries(samplesToJson(minmax)));
  });

  it('an error answer is still read as the JSON error body', async () => {
    vi.stubGlobal('fetch', vi.fn(async () => Response.json({ error: { code: 'not_ready', message: 'The capture is processing' } }, { status: 409 })));
    await expect(getSamples(9, { channel: 0, points: 2 })).rejects.toMatchObject({ status: 409, code: 'not_ready' });
  });
});

describe('sharedSamples', () => {
  it('asks a share link for the binary answer too', async () => {
    const fetchMock = serveBinary(raw);
    expect(await sharedSamples('tok/en', 3, { channel: 1, points: 4 })).toEqual(samplesToJson(raw));
    const [url, init] = fetchMock.mock.calls[0] as unknown as [string, RequestInit];
    expect(url).toBe('/api/shared/tok%2Fen/captures/3/samples?channel=1&points=4');
    expect(init.headers).toMatchObject({ accept: SAMPLES_BINARY_TYPE });
  });
});
