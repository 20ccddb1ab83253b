import type { CaptureDetail } from '../../shared/schemas/capture';
import type { ChannelSetupPatch, CreateProbePresetRequest, ProbePreset } from '../../shared/schemas/channelSetup';
import type { TrendQuery, TrendResponse } from '../../shared/schemas/powerQuality';
import type { SystemsRequest } from '../../shared/schemas/threePhase';
import { api } from './http';
import { queryString as query } from './queryString';

export type TrendRequest = Pick<TrendQuery, 'channel' | 'kind' | 'points'> & { fromS?: number; toS?: number };

export const patchChannel = (id: number, index: number, patch: ChannelSetupPatch) => api<CaptureDetail>('PATCH', `/captures/${id}/channels/${index}`, patch);
export const putSystems = (id: number, systems: SystemsRequest) => api<CaptureDetail>('PUT', `/captures/${id}/systems`, systems);
export const findSystemsAgain = (id: number) => api<CaptureDetail>('DELETE', `/captures/${id}/systems`);
export const putDeclaredVoltage = (id: number, declaredVoltage: number | null) => api<CaptureDetail>('PUT', `/captures/${id}/declared-voltage`, { declaredVoltage });
export const getTrend = (id: number, q: TrendRequest) => api<TrendResponse>('GET', `/captures/${id}/trend?${query(q)}`);
export const sharedTrend = (token: string, id: number, q: TrendRequest) => api<TrendResponse>('GET', `/shared/${token}/captures/${id}/trend?${query(q)}`);
export const listPresets = (projectId: number) => api<{ items: ProbePreset[] }>('GET', `/projects/${projectId}/probe-presets`);
export const createPreset = (projectId: number, req: CreateProbePresetRequest) => api<ProbePreset>('POST', `/projects/${projectId}/probe-presets`, req);
export const deletePreset = (id: number) => api<void>('DELETE', `/probe-presets/${id}`);
