import type { SavedMeterProfile, SaveMeterProfileRequest } from '../../shared/schemas/savedMeterProfile';
import { api } from './http';

export const listMeterProfiles = (projectId: number) => api<{ items: SavedMeterProfile[] }>('GET', `/meter-profiles?projectId=${projectId}`);
export const saveMeterProfile = (req: SaveMeterProfileRequest) => api<SavedMeterProfile>('POST', '/meter-profiles', req);
export const deleteMeterProfile = (id: number) => api<void>('DELETE', `/meter-profiles/${id}`);
