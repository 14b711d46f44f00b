import { createRouter, createWebHistory, type RouteRecordRaw } from 'vue-router';
import { landingPageOf } from '@contracts/permissions.js';
import { setUnauthenticatedHandler } from '@/api/client';
import { useSessionStore } from '@/stores/session';
import { installGuards } from './guards';

declare module 'vue-router' {
  interface RouteMeta {
    /** Reachable without signing in. */
    public?: boolean;
    /** The permission (see server/contracts/permissions.ts) the screen needs. */
    action?: import('@contracts/permissions.js').Action;
    title?: string;
  }
}

export const routes: RouteRecordRaw[] = [
  { path: '/sign-in', name: 'sign-in', component: () => import('@/views/SignInView.vue'), meta: { public: true, title: 'Sign in' } },
  {
    path: '/',
    component: () => import('@/layouts/ShellLayout.vue'),
    children: [
      {
        path: '',
        name: 'home',
        component: () => import('@/views/OverviewView.vue'),
        // Each role lands where its daily work is; the operator's is the oil log entry.
        beforeEnter: () => ({ name: landingPageOf(useSessionStore().role) }),
      },
      {
        path: 'overview',
        name: 'overview',
        component: () => import('@/views/OverviewView.vue'),
        meta: { action: 'sites.read', title: 'Overview' },
      },
      { path: 'lab', name: 'lab', component: () => import('@/views/LabView.vue'), meta: { action: 'lab.read', title: 'Lab' } },
      {
        path: 'lab/certificates/new',
        name: 'lab-certificate-new',
        component: () => import('@/views/CertificateFormView.vue'),
        meta: { action: 'lab.write', title: 'Add a certificate' },
      },
      {
        path: 'lab/certificates/:id/edit',
        name: 'lab-certificate-edit',
        component: () => import('@/views/CertificateFormView.vue'),
        props: true,
        meta: { action: 'lab.write', title: 'Correct a certificate' },
      },
      {
        path: 'lab/certificates/:id',
        name: 'lab-certificate',
        component: () => import('@/views/CertificateView.vue'),
        props: true,
        meta: { action: 'lab.read', title: 'Certificate' },
      },
      {
        path: 'lab/import',
        name: 'lab-import',
        component: () => import('@/views/LabImportView.vue'),
        meta: { action: 'lab.write', title: 'Import lab results' },
      },
      {
        path: 'oil-log',
        name: 'oil-log',
        component: () => import('@/views/OilLogView.vue'),
        meta: { action: 'oil-log.read', title: 'Oil log' },
      },
      {
        path: 'oil-log/equipment',
        name: 'equipment',
        component: () => import('@/views/EquipmentView.vue'),
        meta: { action: 'oil-log.read', title: 'Equipment' },
      },
      {
        path: 'oil-log/equipment/:id',
        name: 'equipment-detail',
        component: () => import('@/views/EquipmentDetailView.vue'),
        props: true,
        meta: { action: 'oil-log.read', title: 'Equipment' },
      },
      {
        path: 'oil-log/equipment/:id/sheet',
        name: 'application-sheet',
        component: () => import('@/views/ApplicationSheetView.vue'),
        props: true,
        meta: { action: 'tools.use', title: 'Application sheet' },
      },
      {
        path: 'oil-log/equipment/:id/upkeep',
        name: 'upkeep-check',
        component: () => import('@/views/UpkeepCheckView.vue'),
        props: true,
        meta: { action: 'oil-log.write', title: 'Upkeep check' },
      },
      {
        path: 'shipments',
        name: 'shipments',
        component: () => import('@/views/ShipmentsView.vue'),
        meta: { action: 'shipments.read', title: 'Shipments' },
      },
      {
        path: 'periods',
        name: 'periods',
        component: () => import('@/views/PeriodsView.vue'),
        meta: { action: 'periods.read', title: 'Periods' },
      },
      {
        path: 'reports',
        name: 'reports',
        component: () => import('@/views/ReportsView.vue'),
        meta: { action: 'periods.read', title: 'Reports' },
      },
      {
        path: 'periods/flow-readings',
        name: 'flow-readings',
        component: () => import('@/views/FlowReadingsView.vue'),
        meta: { action: 'lab.read', title: 'Flow readings' },
      },
      {
        path: 'periods/:id',
        name: 'period',
        component: () => import('@/views/PeriodView.vue'),
        props: true,
        meta: { action: 'periods.read', title: 'Period' },
      },
      {
        path: 'follow-ups',
        name: 'follow-ups',
        component: () => import('@/views/FollowUpsView.vue'),
        meta: { action: 'follow-ups.read', title: 'Follow-ups' },
      },
      { path: 'setup', name: 'setup', component: () => import('@/views/SetupView.vue'), meta: { action: 'sites.read', title: 'Set-up' } },
      { path: 'trail', name: 'trail', component: () => import('@/views/TrailView.vue'), meta: { action: 'trail.read', title: 'Trail' } },
      {
        path: 'setup/people',
        name: 'setup-people',
        component: () => import('@/views/PeopleView.vue'),
        meta: { action: 'users.read', title: 'People and access' },
      },
      {
        path: 'tools/tank-check',
        name: 'tank-check',
        component: () => import('@/views/TankCheckView.vue'),
        meta: { action: 'tools.use', title: 'Tank check' },
      },
      {
        path: 'tools/skimmer-fit',
        name: 'skimmer-fit',
        component: () => import('@/views/SkimmerFitView.vue'),
        meta: { action: 'tools.use', title: 'Skimmer fit' },
      },
      { path: 'mail', name: 'mail', component: () => import('@/views/MailSettingsView.vue'), meta: { title: 'Mail' } },
      {
        path: 'waiting-for-access',
        name: 'no-role',
        component: () => import('@/views/NoRoleView.vue'),
        meta: { title: 'Waiting for access' },
      },
      { path: ':pathMatch(.*)*', name: 'not-found', component: () => import('@/views/NotFoundView.vue'), meta: { title: 'Not found' } },
    ],
  },
];

const router = createRouter({ history: createWebHistory(), routes });
installGuards(router);
setUnauthenticatedHandler(() => {
  const current = router.currentRoute.value;
  // During the first navigation the guard itself sends signed-out users to sign-in.
  const settled = current.matched.length > 0;
  if (settled && !current.meta.public) void router.push({ name: 'sign-in', query: { returnTo: current.fullPath } });
});

export default router;
