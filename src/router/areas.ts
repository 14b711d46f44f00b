import { mdiAccountKeyOutline, mdiCogOutline, mdiFlaskOutline, mdiHistory, mdiOilLevel, mdiTruckOutline, mdiViewDashboardOutline } from '@mdi/js';
import type { Action } from '@contracts/permissions.js';

export interface Area {
  title: string;
  icon: string;
  routeName: string;
  action: Action;
}

/**
 * The areas of the navigation, in product order. Periods, Follow-ups and Tools join this
 * list as they are built.
 */
export const areas: Area[] = [
  { title: 'Overview', icon: mdiViewDashboardOutline, routeName: 'overview', action: 'sites.read' },
  { title: 'Lab', icon: mdiFlaskOutline, routeName: 'lab', action: 'lab.read' },
  { title: 'Oil log', icon: mdiOilLevel, routeName: 'oil-log', action: 'oil-log.read' },
  { title: 'Shipments', icon: mdiTruckOutline, routeName: 'shipments', action: 'shipments.read' },
  { title: 'Trail', icon: mdiHistory, routeName: 'trail', action: 'trail.read' },
  { title: 'Set-up', icon: mdiCogOutline, routeName: 'setup', action: 'setup.manage' },
  { title: 'People and access', icon: mdiAccountKeyOutline, routeName: 'setup-people', action: 'users.read' },
];
