import { decodeSamplesBinary, SAMPLES_BINARY_TYPE } from '../../shared/samples/samplesBinary';
import type { SamplesResponse } from '../../shared/schemas/capture';
import { apiBytes } from './http';

/**
 * A samples answer (signed in or through a share link) asked for as little-endian Float32, about
 * five times fewer bytes than JSON, decoded into the same `RawSamples | MinMaxSamples` union.
 */
export async function fetchSamples(path: string): Promise<SamplesResponse> {
  return decodeSamplesBinary(await apiBytes(path, SAMPLES_BINARY_TYPE));
}
