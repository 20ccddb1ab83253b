import { z } from 'zod';

export const ComparisonSettings = z.object({
  align: z.enum(['zeroCrossing', 'trigger']).default('zeroCrossing'),
  layout: z.enum(['overlay', 'stacked']).default('overlay'),
  /** Channel shown for each capture, in the order of captureIds. */
  channels: z.array(z.number().int().min(0)).default([]),
});
export type ComparisonSettings = z.infer<typeof ComparisonSettings>;

export const Comparison = z.object({
  id: z.number().int(),
  name: z.string(),
  captureIds: z.array(z.number().int()),
  settings: ComparisonSettings,
  createdBy: z.object({ id: z.number().int(), name: z.string() }).nullable(),
  createdAt: z.string(),
});
export type Comparison = z.infer<typeof Comparison>;

export const SaveComparisonRequest = z.object({
  name: z.string().trim().min(1, 'Name the comparison').max(160),
  captureIds: z.array(z.number().int().positive()).min(2, 'Pick at least 2 captures').max(4, 'Compare at most 4 captures'),
  settings: ComparisonSettings.default({ align: 'zeroCrossing', layout: 'overlay', channels: [] }),
});
export type SaveComparisonRequest = z.infer<typeof SaveComparisonRequest>;
