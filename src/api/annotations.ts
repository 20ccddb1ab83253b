import type { Annotation, Comment, CreateAnnotationRequest, UpdateAnnotationRequest } from '../../shared/schemas/annotation';
import { api } from './http';

export const listAnnotations = (captureId: number) => api<{ items: Annotation[] }>('GET', `/captures/${captureId}/annotations`);
export const createAnnotation = (captureId: number, req: Partial<CreateAnnotationRequest> & { startS: number; endS: number; label: string }) =>
  api<Annotation>('POST', `/captures/${captureId}/annotations`, req);
export const updateAnnotation = (id: number, req: UpdateAnnotationRequest) => api<Annotation>('PATCH', `/annotations/${id}`, req);
export const deleteAnnotation = (id: number) => api<void>('DELETE', `/annotations/${id}`);
export const listComments = (captureId: number) => api<{ items: Comment[] }>('GET', `/captures/${captureId}/comments`);
export const addComment = (captureId: number, body: string) => api<Comment>('POST', `/captures/${captureId}/comments`, { body });
