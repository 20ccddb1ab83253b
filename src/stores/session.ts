import { defineStore } from 'pinia';
import { computed, ref } from 'vue';
import type { Role, User } from '../../shared/schemas/user';
import * as authApi from '../api/auth';
import { isApiError } from '../api/http';

export const useSessionStore = defineStore('session', () => {
  const user = ref<User | null>(null);
  const checked = ref(false);

  /** Asks the server once who is signed in (the cookie is httpOnly, so only the server knows). */
  async function ensureLoaded() {
    if (checked.value) return;
    try {
      user.value = (await authApi.me()).user;
    } catch (e) {
      if (!isApiError(e) || e.status !== 401) throw e;
      user.value = null;
    }
    checked.value = true;
  }

  async function signIn(email: string, password: string) {
    user.value = (await authApi.login({ email, password })).user;
    checked.value = true;
  }

  async function signOut() {
    await authApi.logout();
    user.value = null;
  }

  /** Forgets the user after the server said the session is gone (401 elsewhere). */
  function expire() {
    user.value = null;
  }

  const can = (...roles: Role[]) => computed(() => !!user.value && roles.includes(user.value.role));

  /** Whether the user may change something owned by `ownerId` (a project's creator, a mark's owner): the owner or an admin. */
  const owns = (ownerId: number | null | undefined) => !!user.value && (user.value.role === 'admin' || (ownerId != null && ownerId === user.value.id));

  return { user, checked, ensureLoaded, signIn, signOut, expire, can, owns };
});
