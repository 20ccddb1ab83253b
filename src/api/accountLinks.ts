import type { MailMessage, MailSummary } from '../../shared/schemas/mail';
import type { InviteUserRequest, User } from '../../shared/schemas/user';
import { api } from './http';

export const inviteUser = (req: InviteUserRequest) => api<{ user: User }>('POST', '/users/invite', req);
export const requestReset = (email: string) => api<{ message: string }>('POST', '/auth/reset-request', { email });
export const setPassword = (token: string, password: string) => api<void>('POST', '/auth/set-password', { token, password });
export const listMail = () => api<{ items: MailSummary[] }>('GET', '/admin/mail');
export const getMail = (id: number) => api<MailMessage>('GET', `/admin/mail/${id}`);
