import type { AnalysisResponse, CaptureDetail, CaptureList, CaptureListQuery, SamplesQuery, UpdateCaptureRequest, UploadResponse } from '../../shared/schemas/capture';
import { api, ApiError, clientHeaders, toError } from './http';
import { queryString as query } from './queryString';
import { fetchSamples } from './samples';

export const listCaptures = (q: Partial<CaptureListQuery>) => api<CaptureList>('GET', `/captures?${query(q)}`);
export const getCapture = (id: number) => api<CaptureDetail>('GET', `/captures/${id}`);
export const getAnalysis = (id: number) => api<AnalysisResponse>('GET', `/captures/${id}/analysis`);
export const deleteCapture = (id: number) => api<void>('DELETE', `/captures/${id}`);
export const updateCapture = (id: number, req: UpdateCaptureRequest) => api<CaptureDetail>('PATCH', `/captures/${id}`, req);
export const setComtradeValues = (id: number, values: 'primary' | 'secondary') => api<CaptureDetail>('POST', `/captures/${id}/comtrade-values`, { values });
export const giveSampleRate = (id: number, sampleRate: number) => api<CaptureDetail>('POST', `/captures/${id}/sample-rate`, { sampleRate });
export const getSamples = (id: number, q: SamplesQuery) => fetchSamples(`/captures/${id}/samples?${query(q)}`);
export const originalUrl = (id: number) => `/api/captures/${id}/original`;

/** Uploads one file (or a COMTRADE .cfg with its .dat in `data`) with progress (fetch cannot report upload progress, XMLHttpRequest can). */
export function uploadCapture(file: File, fields: { projectId?: number; name?: string; channelSetup?: string; data?: File }, onProgress: (fraction: number) => void): Promise<UploadResponse> {
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open('POST', '/api/captures');
    for (const [name, value] of Object.entries(clientHeaders)) xhr.setRequestHeader(name, value);
    xhr.upload.onprogress = (e) => e.lengthComputable && onProgress(e.loaded / e.total);
    xhr.onerror = () => reject(new ApiError(0, 'network', 'The upload did not reach the server'));
    xhr.onload = async () => {
      const res = new Response(xhr.responseText, { status: xhr.status, headers: { 'content-type': 'application/json' } });
      if (xhr.status >= 200 && xhr.status < 300) resolve(JSON.parse(xhr.responseText));
      else reject(await toError(res));
    };
    const form = new FormData();
    if (fields.projectId) form.append('projectId', String(fields.projectId));
    if (fields.name) form.append('name', fields.name);
    if (fields.channelSetup) form.append('channelSetup', fields.channelSetup);
    form.append('file', file);
    if (fields.data) form.append('data', fields.data);
    xhr.send(form);
  });
}
