import type { ApiTokenCreated, ApiTokenList, CreateApiTokenRequest } from '../../shared/schemas/apiToken';
import { api } from './http';

export const listTokens = () => api<ApiTokenList>('GET', '/tokens');
export const createToken = (req: CreateApiTokenRequest) => api<ApiTokenCreated>('POST', '/tokens', req);
export const revokeToken = (id: number) => api<void>('DELETE', `/tokens/${id}`);
export const listAllTokens = () => api<ApiTokenList>('GET', '/admin/tokens');
