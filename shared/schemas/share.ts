import { z } from 'zod';
import { Annotation } from './annotation';
import { AnalysisResponse, CaptureDetail } from './capture';
import { Comparison } from './comparison';

/**
 * The most points one request of a share link answers. A `points` above it is lowered to it, and a span
 * holding more samples comes back as min/max buckets, so an anonymous reader cannot make the server
 * read and send millions of samples per request.
 */
export const SHARED_MAX_POINTS = 20_000;

export const CreateShareRequest = z.object({
  expiresInDays: z.number().int().min(1).max(365).optional(),
  email: z.string().trim().toLowerCase().email().max(254).optional(),
  message: z.string().trim().max(1000).optional(),
});
export type CreateShareRequest = z.infer<typeof CreateShareRequest>;

export const ShareCreated = z.object({ id: z.number().int(), token: z.string(), url: z.string(), expiresAt: z.string() });
export type ShareCreated = z.infer<typeof ShareCreated>;

export const ShareInfo = z.object({
  id: z.number().int(),
  email: z.string().nullable(),
  createdBy: z.string().nullable(),
  createdAt: z.string(),
  expiresAt: z.string(),
  lastOpenedAt: z.string().nullable(),
  openCount: z.number().int(),
});
export type ShareInfo = z.infer<typeof ShareInfo>;

export const SharedCapture = z.object({ capture: CaptureDetail, analysis: AnalysisResponse, annotations: z.array(Annotation) });
export type SharedCapture = z.infer<typeof SharedCapture>;

/** What a share link shows: one capture, or a saved comparison with its captures. */
export const SharedView = z.object({
  kind: z.enum(['capture', 'comparison']),
  sharedBy: z.string(),
  expiresAt: z.string(),
  comparison: Comparison.nullable(),
  captures: z.array(SharedCapture),
});
export type SharedView = z.infer<typeof SharedView>;
