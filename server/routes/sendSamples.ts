import type { Request, Response } from 'express';
import { encodeSamplesBinary, SAMPLES_BINARY_TYPE, samplesToJson, type SampleWindowData } from '../../shared/samples/samplesBinary';

/**
 * Answers a samples request in the form the client asks for: little-endian Float32 after a small header
 * for `Accept: application/octet-stream` (Crestline's own client), JSON for everyone else.
 */
export function sendSamples(req: Request, res: Response, data: SampleWindowData): void {
  res.vary('Accept');
  if (req.accepts(['application/json', SAMPLES_BINARY_TYPE]) === SAMPLES_BINARY_TYPE) {
    res.type(SAMPLES_BINARY_TYPE).send(Buffer.from(encodeSamplesBinary(data).buffer));
  } else res.json(samplesToJson(data));
}
