import type { AddMemberRequest, MemberCandidate, ProjectMember, ProjectMemberList } from '../../shared/schemas/projectMember';
import { api } from './http';

export const listMembers = (projectId: number) => api<ProjectMemberList>('GET', `/projects/${projectId}/members`);
export const listCandidates = (projectId: number) => api<{ items: MemberCandidate[] }>('GET', `/projects/${projectId}/member-candidates`);
export const addMember = (projectId: number, req: AddMemberRequest) => api<{ member: ProjectMember }>('POST', `/projects/${projectId}/members`, req);
export const removeMember = (projectId: number, userId: number) => api<void>('DELETE', `/projects/${projectId}/members/${userId}`);
