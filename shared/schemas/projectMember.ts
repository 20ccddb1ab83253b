import { z } from 'zod';

/**
 * A member's role within a members-only project. It can only narrow what the member's own role allows:
 * an engineer added as 'viewer' reads and comments there; a viewer cannot be added as 'engineer'.
 */
export const MemberRole = z.enum(['engineer', 'viewer']);
export type MemberRole = z.infer<typeof MemberRole>;

export const AddMemberRequest = z.object({ userId: z.number().int().positive(), role: MemberRole });
export type AddMemberRequest = z.infer<typeof AddMemberRequest>;

export const MemberParams = z.object({ id: z.coerce.number().int().positive(), userId: z.coerce.number().int().positive() });

export const ProjectMember = z.object({
  userId: z.number().int(),
  name: z.string(),
  email: z.string(),
  role: MemberRole,
  addedAt: z.string(),
});
export type ProjectMember = z.infer<typeof ProjectMember>;

export const ProjectMemberList = z.object({ items: z.array(ProjectMember) });
export type ProjectMemberList = z.infer<typeof ProjectMemberList>;

/** Someone who could be added: active users who are not members yet, for the project's managers. */
export const MemberCandidate = z.object({ id: z.number().int(), name: z.string(), email: z.string(), role: z.enum(['admin', 'engineer', 'viewer']) });
export type MemberCandidate = z.infer<typeof MemberCandidate>;
