// @vitest-environment happy-dom
import { flushPromises } from '@vue/test-utils';
import { afterEach, describe, expect, it } from 'vitest';
import AppNavDrawer from '../../../../src/components/AppNavDrawer.vue';
import AppTopBar from '../../../../src/components/AppTopBar.vue';
import { useSessionStore } from '../../../../src/stores/session';
import { mountInApp } from '../harness';

afterEach(() => (document.body.innerHTML = ''));

describe('AppTopBar', () => {
  it('its menu button asks for the navigation panel and says whether it is open', async () => {
    const { wrapper } = mountInApp(AppTopBar, { props: { menuOpen: false } });
    const menu = wrapper.find('[data-test=menu-button]');
    expect(menu.attributes()).toMatchObject({ 'aria-label': 'Menu', 'aria-expanded': 'false', 'aria-controls': 'crest-nav-drawer' });
    await menu.trigger('click');
    expect(wrapper.emitted('menu')).toHaveLength(1);
    await wrapper.setProps({ menuOpen: true });
    expect(menu.attributes('aria-expanded')).toBe('true');
  });
});

describe('AppNavDrawer', () => {
  it('holds the navigation and the account, and closes once a page is chosen', async () => {
    const { wrapper, router } = mountInApp(AppNavDrawer, { props: { open: true } });
    const session = useSessionStore();
    session.user = { id: 1, email: 'admin@example.org', name: 'Ada Admin', role: 'admin' };
    await flushPromises();
    const drawer = document.querySelector('[data-test=nav-drawer]')!;
    expect(drawer.getAttribute('aria-label')).toBe('Menu');
    expect([...drawer.querySelectorAll('nav a')].map((a) => a.textContent!.trim())).toEqual(['Projects', 'Compare', 'People & roles', 'Outgoing mail', 'Account', 'Safety & help']);
    expect(drawer.textContent).toMatch(/Ada Admin\s*admin/);
    await router.push('/compare');
    await flushPromises();
    expect(wrapper.emitted('update:open')).toEqual([[false]]);
  });
});
