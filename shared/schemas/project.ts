import { z } from 'zod';

export const Project = z.object({
  id: z.number().int(),
  name: z.string(),
  description: z.string(),
  archived: z.boolean(),
  /** Declared supply voltage (V) for the project's captures, or null. */
  declaredVoltage: z.number().nullable(),
  createdBy: z.number().int().nullable(),
  createdAt: z.string(),
  captureCount: z.number().int(),
});
export type Project = z.infer<typeof Project>;

export const CreateProjectRequest = z.object({
  name: z.string().trim().min(1, 'Give the project a name').max(160),
  description: z.string().trim().max(2000).default(''),
});
export type CreateProjectRequest = z.infer<typeof CreateProjectRequest>;

export const UpdateProjectRequest = z
  .object({ name: z.string().trim().min(1).max(160).optional(), description: z.string().trim().max(2000).optional(), archived: z.boolean().optional(), declaredVoltage: z.number().min(1).max(1_000_000).nullable().optional() })
  .refine((v) => Object.keys(v).length > 0, 'Nothing to change');
export type UpdateProjectRequest = z.infer<typeof UpdateProjectRequest>;

export const ProjectListQuery = z.object({ archived: z.enum(['true', 'false', 'all']).default('false') });
