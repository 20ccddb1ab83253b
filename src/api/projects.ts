import type { CreateProjectRequest, Project, UpdateProjectRequest } from '../../shared/schemas/project';
import { api } from './http';

export const listProjects = (archived: 'true' | 'false' | 'all' = 'false') => api<{ items: Project[] }>('GET', `/projects?archived=${archived}`);
export const getProject = (id: number) => api<{ project: Project }>('GET', `/projects/${id}`);
export const createProject = (req: CreateProjectRequest) => api<{ project: Project }>('POST', '/projects', req);
export const updateProject = (id: number, req: UpdateProjectRequest) => api<{ project: Project }>('PATCH', `/projects/${id}`, req);
export const addDemoCaptures = (id: number) => api<{ added: number }>('POST', `/projects/${id}/demo-captures`);
