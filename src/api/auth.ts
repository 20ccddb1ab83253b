import type { SessionList } from '../../shared/schemas/session';
import type { ChangePasswordRequest, LoginRequest, User } from '../../shared/schemas/user';
import { api } from './http';

export const login = (req: LoginRequest) => api<{ user: User }>('POST', '/auth/login', req);
export const logout = () => api<void>('POST', '/auth/logout');
export const me = () => api<{ user: User }>('GET', '/auth/me');
export const changePassword = (req: ChangePasswordRequest) => api<void>('POST', '/auth/password', req);
export const listSessions = () => api<SessionList>('GET', '/auth/sessions');
export const signOutOtherSessions = () => api<void>('DELETE', '/auth/sessions');
