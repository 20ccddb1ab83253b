import { z } from 'zod';

export const Severity = z.enum(['info', 'warning', 'fault']);
export type Severity = z.infer<typeof Severity>;

export const Annotation = z.object({
  id: z.number().int(),
  captureId: z.number().int(),
  channelIdx: z.number().int().nullable(),
  startS: z.number(),
  endS: z.number(),
  label: z.string(),
  note: z.string(),
  severity: Severity,
  /** 'finder' marks a suggestion of the anomaly finder; 'user' an engineer's own mark. */
  source: z.enum(['user', 'finder']),
  /** A finder suggestion stays 'suggested' until accepted ('active') or 'dismissed'. */
  state: z.enum(['active', 'suggested', 'dismissed']),
  reason: z.string().nullable(),
  createdBy: z.object({ id: z.number().int(), name: z.string() }).nullable(),
  createdAt: z.string(),
});
export type Annotation = z.infer<typeof Annotation>;

const span = { startS: z.number().finite(), endS: z.number().finite() };

export const CreateAnnotationRequest = z
  .object({
    ...span,
    label: z.string().trim().min(1, 'Give the mark a label').max(160),
    note: z.string().trim().max(4000).default(''),
    severity: Severity.default('info'),
    channelIdx: z.number().int().min(0).nullable().default(null),
  })
  .refine((a) => a.endS >= a.startS, 'endS must not be before startS');
export type CreateAnnotationRequest = z.infer<typeof CreateAnnotationRequest>;

export const UpdateAnnotationRequest = z
  .object({
    startS: z.number().finite().optional(),
    endS: z.number().finite().optional(),
    label: z.string().trim().min(1).max(160).optional(),
    note: z.string().trim().max(4000).optional(),
    severity: Severity.optional(),
    state: z.enum(['active', 'dismissed']).optional(),
  })
  .refine((v) => Object.keys(v).length > 0, 'Nothing to change');
export type UpdateAnnotationRequest = z.infer<typeof UpdateAnnotationRequest>;

export const Comment = z.object({
  id: z.number().int(),
  captureId: z.number().int(),
  body: z.string(),
  createdBy: z.object({ id: z.number().int(), name: z.string() }).nullable(),
  createdAt: z.string(),
});
export type Comment = z.infer<typeof Comment>;

export const CreateCommentRequest = z.object({ body: z.string().trim().min(1, 'Write something').max(4000) });
