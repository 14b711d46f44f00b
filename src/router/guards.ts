import type { Router } from 'vue-router';
import { useSessionStore } from '@/stores/session';

/** Signed-out users go to sign-in; a user without a role waits; a screen beyond the role is not found. */
export function installGuards(router: Router): void {
  router.beforeEach(async (to) => {
    const session = useSessionStore();
    await session.load();
    if (to.meta.public) return true;
    if (!session.signedIn) return { name: 'sign-in', query: to.fullPath === '/' ? {} : { returnTo: to.fullPath } };
    if (!session.role && to.name !== 'no-role') return { name: 'no-role' };
    if (to.meta.action && !session.can(to.meta.action)) {
      return { name: 'not-found', params: { pathMatch: to.path.slice(1).split('/') } };
    }
    return true;
  });
  router.afterEach((to) => {
    document.title = to.meta.title ? `${to.meta.title} · Decant` : 'Decant';
  });
}
