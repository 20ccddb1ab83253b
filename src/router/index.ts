import { createRouter, createWebHistory, type RouteLocationRaw, type RouteRecordRaw } from 'vue-router';
import type { Role } from '../../shared/schemas/user';
import { useSessionStore } from '../stores/session';

export type AppRouteName = 'sign-in' | 'projects' | 'project' | 'capture' | 'compare' | 'comparison' | 'admin-users' | 'admin-mail' | 'account' | 'shared' | 'reset-password' | 'set-password' | 'help' | 'help-automation' | 'not-found';

declare module 'vue-router' {
  interface RouteMeta {
    /** Reachable without signing in. */
    public?: boolean;
    /** Shown without the workspace's navigation (sign-in, shared links). */
    bare?: boolean;
    /** Roles that may open it; any signed-in user when absent. */
    roles?: Role[];
  }
}

export const routes: (RouteRecordRaw & { name: AppRouteName })[] = [
  { path: '/sign-in', name: 'sign-in', component: () => import('../views/SignInView.vue'), meta: { public: true, bare: true } },
  { path: '/shared/:token', name: 'shared', component: () => import('../views/SharedView.vue'), props: true, meta: { public: true, bare: true } },
  { path: '/reset-password', name: 'reset-password', component: () => import('../views/ResetPasswordView.vue'), meta: { public: true, bare: true } },
  { path: '/set-password', name: 'set-password', component: () => import('../views/SetPasswordView.vue'), meta: { public: true, bare: true } },
  { path: '/', name: 'projects', component: () => import('../views/ProjectsView.vue') },
  { path: '/projects/:id', name: 'project', component: () => import('../views/ProjectView.vue'), props: (r) => ({ id: Number(r.params.id) }) },
  { path: '/captures/:id', name: 'capture', component: () => import('../views/CaptureView.vue'), props: (r) => ({ id: Number(r.params.id) }) },
  { path: '/compare', name: 'compare', component: () => import('../views/CompareView.vue') },
  { path: '/comparisons/:id', name: 'comparison', component: () => import('../views/CompareView.vue'), props: (r) => ({ comparisonId: Number(r.params.id) }) },
  { path: '/admin/users', name: 'admin-users', component: () => import('../views/AdminUsersView.vue'), meta: { roles: ['admin'] } },
  { path: '/admin/mail', name: 'admin-mail', component: () => import('../views/AdminMailView.vue'), meta: { roles: ['admin'] } },
  { path: '/account', name: 'account', component: () => import('../views/AccountView.vue') },
  { path: '/help', name: 'help', component: () => import('../views/HelpView.vue'), meta: { public: true } },
  { path: '/help/automate-uploads', name: 'help-automation', component: () => import('../views/AutomateUploadsView.vue'), meta: { public: true } },
  { path: '/:pathMatch(.*)*', name: 'not-found', component: () => import('../views/NotFoundView.vue'), meta: { public: true } },
];

export const router = createRouter({ history: createWebHistory(), routes });

router.beforeEach(async (to) => {
  const session = useSessionStore();
  await session.ensureLoaded();
  if (to.meta.public) return to.name === 'sign-in' && session.user ? { name: 'projects' } : true;
  if (!session.user) return { name: 'sign-in', query: { next: to.fullPath } };
  if (to.meta.roles && !to.meta.roles.includes(session.user.role)) return { name: 'projects' };
  return true;
});

/** A typed route location: a misspelt route name fails the type check. */
export const to = (name: AppRouteName, params?: Record<string, string | number>, query?: Record<string, string>): RouteLocationRaw => ({
  name,
  params,
  query,
});
