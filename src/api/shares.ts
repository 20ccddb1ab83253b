import type { SamplesQuery } from '../../shared/schemas/capture';
import type { CreateShareRequest, ShareCreated, ShareInfo, SharedView } from '../../shared/schemas/share';
import { api } from './http';
import { queryString } from './queryString';
import { fetchSamples } from './samples';

type Target = { kind: 'captures' | 'comparisons'; id: number };
export const createShare = (t: Target, req: CreateShareRequest) => api<ShareCreated>('POST', `/${t.kind}/${t.id}/shares`, req);
export const listShares = (t: Target) => api<{ items: ShareInfo[] }>('GET', `/${t.kind}/${t.id}/shares`);
export const revokeShare = (id: number) => api<void>('DELETE', `/shares/${id}`);
export const openShared = (token: string) => api<SharedView>('GET', `/shared/${encodeURIComponent(token)}`);
export const sharedSamples = (token: string, captureId: number, q: SamplesQuery) =>
  fetchSamples(`/shared/${encodeURIComponent(token)}/captures/${captureId}/samples?${queryString(q)}`);
