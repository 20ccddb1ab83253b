import { z } from 'zod';
import { Role } from './user';

/** 'team': every signed-in user sees the project. 'members': only its members, its creator and admins. */
export const ProjectVisibility = z.enum(['team', 'members']);
export type ProjectVisibility = z.infer<typeof ProjectVisibility>;

export const Project = z.object({
  id: z.number().int(),
  name: z.string(),
  description: z.string(),
  archived: z.boolean(),
  visibility: ProjectVisibility,
  /** What the asking user may do in this project: their own role, narrowed by a member role. */
  yourRole: Role,
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
  visibility: ProjectVisibility.default('team'),
});
export type CreateProjectRequest = z.infer<typeof CreateProjectRequest>;

export const UpdateProjectRequest = z
  .object({ name: z.string().trim().min(1).max(160).optional(), description: z.string().trim().max(2000).optional(), archived: z.boolean().optional(), visibility: ProjectVisibility.optional(), declaredVoltage: z.number().min(1).max(1_000_000).nullable().optional() })
  .refine((v) => Object.keys(v).length > 0, 'Nothing to change');
export type UpdateProjectRequest = z.infer<typeof UpdateProjectRequest>;

export const ProjectListQuery = z.object({ archived: z.enum(['true', 'false', 'all']).default('false') });
