import { Foundation1796205600000 } from './1796205600000-Foundation.js';
import { SetupAndLab1796209200000 } from './1796209200000-SetupAndLab.js';
import { OilAndShipments1796212800000 } from './1796212800000-OilAndShipments.js';
import { Periods1796216400000 } from './1796216400000-Periods.js';
import { ReportSubmissions1796220000000 } from './1796220000000-ReportSubmissions.js';
import { MassLimits1796223600000 } from './1796223600000-MassLimits.js';
import { KeptRecordsRestrict1796227200000 } from './1796227200000-KeptRecordsRestrict.js';
import { TrailChain1796230800000 } from './1796230800000-TrailChain.js';
import { FileOwners1796234400000 } from './1796234400000-FileOwners.js';
import { DocumentKeys1796238000000 } from './1796238000000-DocumentKeys.js';
import { PeriodSignOff1796241600000 } from './1796241600000-PeriodSignOff.js';
import { PermitSettingsVersions1796245200000 } from './1796245200000-PermitSettingsVersions.js';
import { ImportRuns1796248800000 } from './1796248800000-ImportRuns.js';
import { PeriodPacks1796252400000 } from './1796252400000-PeriodPacks.js';
import { PeriodLockFastPath1796256000000 } from './1796256000000-PeriodLockFastPath.js';
import { PeriodPackWorkbooks1796259600000 } from './1796259600000-PeriodPackWorkbooks.js';
import { Notices1796263200000 } from './1796263200000-Notices.js';
import { AwarenessTime1796266800000 } from './1796266800000-AwarenessTime.js';
import { FollowUpsCloseThemselves1796270400000 } from './1796270400000-FollowUpsCloseThemselves.js';
import { AuthorityNotices1796274000000 } from './1796274000000-AuthorityNotices.js';
import { MailDropped1796277600000 } from './1796277600000-MailDropped.js';
import { EquipmentTools1796281200000 } from './1796281200000-EquipmentTools.js';

/** In the order they run. A merged migration is never edited: add a new one. */
export const migrations = [
  Foundation1796205600000,
  SetupAndLab1796209200000,
  OilAndShipments1796212800000,
  Periods1796216400000,
  ReportSubmissions1796220000000,
  MassLimits1796223600000,
  KeptRecordsRestrict1796227200000,
  TrailChain1796230800000,
  FileOwners1796234400000,
  DocumentKeys1796238000000,
  PeriodSignOff1796241600000,
  PermitSettingsVersions1796245200000,
  ImportRuns1796248800000,
  PeriodPacks1796252400000,
  PeriodLockFastPath1796256000000,
  PeriodPackWorkbooks1796259600000,
  Notices1796263200000,
  AwarenessTime1796266800000,
  FollowUpsCloseThemselves1796270400000,
  AuthorityNotices1796274000000,
  MailDropped1796277600000,
  EquipmentTools1796281200000,
];
