import { z } from 'zod';

export const Role = z.enum(['admin', 'engineer', 'viewer']);
export type Role = z.infer<typeof Role>;

export const User = z.object({
  id: z.number().int(),
  email: z.string(),
  name: z.string(),
  role: Role,
  active: z.boolean().optional(),
});
export type User = z.infer<typeof User>;

export const LoginRequest = z.object({
  email: z.string().trim().toLowerCase().email().max(254),
  password: z.string().min(1).max(200),
});
export type LoginRequest = z.infer<typeof LoginRequest>;

export const Password = z.string().min(10, 'Use at least 10 characters').max(200);

export const CreateUserRequest = z.object({
  email: z.string().trim().toLowerCase().email().max(254),
  name: z.string().trim().min(1).max(120),
  role: Role,
  password: Password,
});
export type CreateUserRequest = z.infer<typeof CreateUserRequest>;

export const UpdateUserRequest = z
  .object({ role: Role.optional(), active: z.boolean().optional(), name: z.string().trim().min(1).max(120).optional() })
  .refine((v) => Object.keys(v).length > 0, 'Nothing to change');
export type UpdateUserRequest = z.infer<typeof UpdateUserRequest>;

export const ChangePasswordRequest = z.object({ currentPassword: z.string().min(1).max(200), newPassword: Password });
export type ChangePasswordRequest = z.infer<typeof ChangePasswordRequest>;

export const IdParam = z.object({ id: z.coerce.number().int().positive() });

export const InviteUserRequest = z.object({
  email: z.string().trim().toLowerCase().email().max(254),
  name: z.string().trim().min(1).max(120),
  role: Role,
});
export type InviteUserRequest = z.infer<typeof InviteUserRequest>;

export const ResetRequest = z.object({ email: z.string().trim().toLowerCase().email().max(254) });
export type ResetRequest = z.infer<typeof ResetRequest>;

export const SetPasswordRequest = z.object({ token: z.string().min(20).max(100), password: Password });
export type SetPasswordRequest = z.infer<typeof SetPasswordRequest>;
