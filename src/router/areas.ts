import {
  mdiAccountKeyOutline,
  mdiBellAlertOutline,
  mdiCalendarRange,
  mdiFileCertificateOutline,
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
  /** Hidden from those who can do this (they have the fuller area). */
  unless?: Action;
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
  // The same page, read as a view by those who do not manage it (the auditor checks the limits there).
  { title: 'Permit and limits', icon: mdiFileCertificateOutline, routeName: 'setup', action: 'sites.read', unless: 'setup.manage' },
  { title: 'People and access', icon: mdiAccountKeyOutline, routeName: 'setup-people', action: 'users.read' },
];
