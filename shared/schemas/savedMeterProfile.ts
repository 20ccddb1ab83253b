import { z } from 'zod';
import { FrontEndProfile } from './meterSimulation';

export const MeterProfileScope = z.enum(['project', 'account']);
export type MeterProfileScope = z.infer<typeof MeterProfileScope>;

/** A meter front end saved for a project's team or in the caller's own account. */
export const SavedMeterProfile = z.object({
  id: z.number().int(),
  name: z.string(),
  scope: MeterProfileScope,
  projectId: z.number().int().nullable(),
  profile: FrontEndProfile,
  createdBy: z.object({ id: z.number().int(), name: z.string() }),
  createdAt: z.string(),
  /** Whether the caller may delete it: its creator or an admin. */
  canDelete: z.boolean(),
});
export type SavedMeterProfile = z.infer<typeof SavedMeterProfile>;

export const SaveMeterProfileRequest = z
  .object({
    name: z.string().trim().min(1, 'Name the profile').max(120),
    scope: MeterProfileScope,
    projectId: z.number().int().positive().optional(),
    profile: FrontEndProfile,
  })
  .refine((v) => v.scope === 'account' || v.projectId !== undefined, { message: 'A project profile needs its projectId', path: ['projectId'] })
  .refine((v) => v.scope === 'project' || v.projectId === undefined, { message: 'An account profile belongs to no project', path: ['projectId'] });
export type SaveMeterProfileRequest = z.infer<typeof SaveMeterProfileRequest>;

/** Profiles of one project (with the caller's own), or of every project when none is named. */
export const MeterProfileListQuery = z.object({ projectId: z.coerce.number().int().positive().optional() });
export type MeterProfileListQuery = z.infer<typeof MeterProfileListQuery>;
