import { createPinia, setActivePinia } from 'pinia';
import { beforeEach, describe, expect, it, vi } from 'vitest';
import * as authApi from '../../../../src/api/auth';
import { ApiError } from '../../../../src/api/http';
import { useSessionStore } from '../../../../src/stores/session';

vi.mock('../../../../src/api/auth');
const engineer = { id: 2, email: 'eng@example.org', name: 'Eve', role: 'engineer' as const };

beforeEach(() => {
  setActivePinia(createPinia());
  vi.resetAllMocks();
});

describe('the session store', () => {
  it('asks the server once who is signed in', async () => {
    vi.mocked(authApi.me).mockResolvedValue({ user: engineer });
    const session = useSessionStore();
    await session.ensureLoaded();
    await session.ensureLoaded();
    expect(authApi.me).toHaveBeenCalledTimes(1);
    expect(session.user).toEqual(engineer);
  });

  it('a 401 means nobody is signed in', async () => {
    vi.mocked(authApi.me).mockRejectedValue(new ApiError(401, 'unauthorized', 'Sign in first'));
    const session = useSessionStore();
    await session.ensureLoaded();
    expect(session.user).toBeNull();
    expect(session.checked).toBe(true);
  });

  it('any other failure is not taken for "signed out"', async () => {
    vi.mocked(authApi.me).mockRejectedValue(new ApiError(503, 'unavailable', 'The database is away'));
    await expect(useSessionStore().ensureLoaded()).rejects.toThrow('The database is away');
  });

  it('signs in and out, and says what the role may do', async () => {
    vi.mocked(authApi.login).mockResolvedValue({ user: engineer });
    vi.mocked(authApi.logout).mockResolvedValue(undefined);
    const session = useSessionStore();
    const mayEdit = session.can('admin', 'engineer');
    const mayAdminister = session.can('admin');
    await session.signIn('eng@example.org', 'secret-password');
    expect(authApi.login).toHaveBeenCalledWith({ email: 'eng@example.org', password: 'secret-password' });
    expect([mayEdit.value, mayAdminister.value]).toEqual([true, false]);
    await session.signOut();
    expect(session.user).toBeNull();
    expect(mayEdit.value).toBe(false);
  });
});
