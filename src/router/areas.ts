import {
  mdiAccountKeyOutline,
  mdiBellAlertOutline,
  mdiCalendarRange,
  mdiFileDocumentMultipleOutline,
  mdiCogOutline,
  mdiFlaskOutline,
  mdiHistory,
  mdiOilLevel,
  mdiScaleUnbalanced,
  mdiTruckOutline,
  mdiViewDashboardOutline,
  mdiWaterOutline,
} from '@mdi/js';
import type { Action } from '@contracts/permissions.js';

export interface Area {
  title: string;
  icon: string;
  routeName: string;
  action: Action;
}

/**
 * The areas of the navigation, in product order.
 */
export const areas: Area[] = [
  { title: 'Overview', icon: mdiViewDashboardOutline, routeName: 'overview', action: 'sites.read' },
  { title: 'Lab', icon: mdiFlaskOutline, routeName: 'lab', action: 'lab.read' },
  { title: 'Oil log', icon: mdiOilLevel, routeName: 'oil-log', action: 'oil-log.read' },
  { title: 'Shipments', icon: mdiTruckOutline, routeName: 'shipments', action: 'shipments.read' },
  { title: 'Periods', icon: mdiCalendarRange, routeName: 'periods', action: 'periods.read' },
  { title: 'Reports', icon: mdiFileDocumentMultipleOutline, routeName: 'reports', action: 'periods.read' },
  { title: 'Follow-ups', icon: mdiBellAlertOutline, routeName: 'follow-ups', action: 'follow-ups.read' },
  { title: 'Trail', icon: mdiHistory, routeName: 'trail', action: 'trail.read' },
  { title: 'Tank check', icon: mdiWaterOutline, routeName: 'tank-check', action: 'tools.use' },
  { title: 'Skimmer fit', icon: mdiScaleUnbalanced, routeName: 'skimmer-fit', action: 'tools.use' },
  { title: 'Set-up', icon: mdiCogOutline, routeName: 'setup', action: 'setup.manage' },
  { title: 'People and access', icon: mdiAccountKeyOutline, routeName: 'setup-people', action: 'users.read' },
];
