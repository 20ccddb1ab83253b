import { mount, type ComponentMountingOptions } from '@vue/test-utils';
import { createPinia, setActivePinia } from 'pinia';
import PrimeVue from 'primevue/config';
import ToastService from 'primevue/toastservice';
import { defineComponent, h, type Component } from 'vue';
import { createMemoryHistory, createRouter, type Router } from 'vue-router';
import { routes } from '../../../src/router';

/**
 * What the app gives every component, for a test DOM: a fresh Pinia, the app's routes in memory (no
 * guards, so no server is asked who is signed in), PrimeVue without its theme, and toasts.
 */
export function appPlugins() {
  const pinia = createPinia();
  setActivePinia(pinia);
  const router = createRouter({ history: createMemoryHistory(), routes });
  return { pinia, router, plugins: [pinia, router, [PrimeVue, { theme: 'none' }], ToastService] as const };
}

/** Mounts a component as the app would, attached to the document (for focus and teleported overlays). */
export function mountInApp<C extends Component>(component: C, options: ComponentMountingOptions<C> = {}): { wrapper: ReturnType<typeof mount>; router: Router } {
  const { plugins, router } = appPlugins();
  const wrapper = mount(component as never, { attachTo: document.body, ...(options as object), global: { plugins: [...plugins] as never } });
  return { wrapper, router };
}

/** Runs a composable inside a mounted component, as a view runs it, and returns what it gave. */
export function withSetup<R>(composable: () => R) {
  const { plugins, router } = appPlugins();
  let result!: R;
  const wrapper = mount(defineComponent({ setup: () => ((result = composable()), () => h('div')) }), { attachTo: document.body, global: { plugins: [...plugins] as never } });
  return { result, wrapper, router };
}
