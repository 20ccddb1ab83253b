import { describe, expect, it } from 'vitest';
import { roleInProject, roleInProjects, type ProjectScope } from '../../server/services/projectRole';

const engineer = { id: 7, role: 'engineer' as const };
const viewer = { id: 8, role: 'viewer' as const };
const admin = { id: 1, role: 'admin' as const };
const team: ProjectScope = { visibility: 'team', createdBy: 3, memberRole: null };
const closed: ProjectScope = { visibility: 'members', createdBy: 3, memberRole: null };

describe('roleInProject', () => {
  it('a team project: everyone with their own role, as before members-only projects', () => {
    expect(roleInProject(engineer, team)).toBe('engineer');
    expect(roleInProject(viewer, team)).toBe('viewer');
    expect(roleInProject(engineer, { ...team, memberRole: 'viewer' })).toBe('engineer');
  });

  it('a members-only project: hidden from someone who is neither member, creator nor admin', () => {
    expect(roleInProject(engineer, closed)).toBeNull();
    expect(roleInProject(engineer, { ...closed, createdBy: null })).toBeNull();
  });

  it('a members-only project: its creator and admins with their own role', () => {
    expect(roleInProject(engineer, { ...closed, createdBy: 7 })).toBe('engineer');
    expect(roleInProject(admin, closed)).toBe('admin');
  });

  it('a member: their own role narrowed by the member role, never lifted above it', () => {
    expect(roleInProject(engineer, { ...closed, memberRole: 'engineer' })).toBe('engineer');
    expect(roleInProject(engineer, { ...closed, memberRole: 'viewer' })).toBe('viewer');
    expect(roleInProject(viewer, { ...closed, memberRole: 'engineer' })).toBe('viewer');
  });
});

describe('roleInProjects', () => {
  it('several projects (a comparison): the lowest role, or hidden if any one is', () => {
    expect(roleInProjects(engineer, [team, { ...closed, memberRole: 'viewer' }])).toBe('viewer');
    expect(roleInProjects(engineer, [team, closed])).toBeNull();
    expect(roleInProjects(engineer, [])).toBe('engineer');
  });
});
