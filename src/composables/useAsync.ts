import { useToast } from 'primevue/usetoast';
import { ref } from 'vue';
import { useRouter } from 'vue-router';
import { isApiError } from '../api/http';
import { useSessionStore } from '../stores/session';
import { to } from '../router';

/**
 * Runs API calls for a view: a loading flag, errors as toasts with the server's message, and a 401
 * sending the user back to sign-in, all in one place.
 */
export function useAsync() {
  const loading = ref(false);
  const toast = useToast();
  const router = useRouter();
  const session = useSessionStore();

  async function run<T>(fn: () => Promise<T>, opts: { success?: string } = {}): Promise<T | undefined> {
    loading.value = true;
    try {
      const result = await fn();
      if (opts.success) toast.add({ severity: 'success', summary: opts.success, life: 3000 });
      return result;
    } catch (e) {
      if (isApiError(e) && e.status === 401 && router.currentRoute.value.name !== 'sign-in') {
        session.expire();
        await router.push(to('sign-in', {}, { next: router.currentRoute.value.fullPath }));
        return undefined;
      }
      const detail = isApiError(e) ? e.message + (e.line ? ` (line ${e.line})` : '') : String(e);
      toast.add({ severity: 'error', summary: 'Could not complete that', detail, life: 6000 });
      return undefined;
    } finally {
      loading.value = false;
    }
  }

  return { loading, run };
}
