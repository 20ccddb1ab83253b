import type { CreateUserRequest, UpdateUserRequest, User } from '../../shared/schemas/user';
import { api } from './http';

export const listUsers = () => api<{ items: User[] }>('GET', '/users');
export const createUser = (req: CreateUserRequest) => api<{ user: User }>('POST', '/users', req);
export const updateUser = (id: number, req: UpdateUserRequest) => api<{ user: User }>('PATCH', `/users/${id}`, req);
export const signOutEverywhere = (id: number) => api<void>('DELETE', `/users/${id}/sessions`);
