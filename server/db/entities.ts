import { Session } from '../auth/session.entity.js';
import { DischargePoint } from '../features/discharge-points/discharge-point.entity.js';
import { Equipment } from '../features/equipment/equipment.entity.js';
import { FlowReading } from '../features/flow-readings/flow-reading.entity.js';
import { FollowUp } from '../features/follow-ups/follow-up.entity.js';
import { LabCertificate } from '../features/lab/lab-certificate.entity.js';
import { LabResult } from '../features/lab/lab-result.entity.js';
import { LabSample } from '../features/lab/lab-sample.entity.js';
import { QcBatch } from '../features/lab/qc-batch.entity.js';
import { OilLogEntry } from '../features/oil-log/oil-log-entry.entity.js';
import { Parameter } from '../features/parameters/parameter.entity.js';
import { PeriodAmendment } from '../features/periods/period-amendment.entity.js';
import { PeriodSignature } from '../features/periods/period-signature.entity.js';
import { ReportingPeriod } from '../features/periods/reporting-period.entity.js';
import { PermitLimit } from '../features/permits/permit-limit.entity.js';
import { PermitSettings } from '../features/permits/permit-settings.entity.js';
import { Permit } from '../features/permits/permit.entity.js';
import { ShipmentFile } from '../features/shipments/shipment-file.entity.js';
import { Shipment } from '../features/shipments/shipment.entity.js';
import { UpkeepCheck } from '../features/upkeep/upkeep-check.entity.js';
import { StoredFile } from '../kernel/files/stored-file.entity.js';
import { ImportRun } from '../kernel/imports/import-run.entity.js';
import { UserSite } from '../kernel/people/user-site.entity.js';
import { User } from '../kernel/people/user.entity.js';
import { Company } from '../kernel/sites/company.entity.js';
import { Site } from '../kernel/sites/site.entity.js';
import { TrailChainHead } from '../kernel/trail/trail-chain-head.entity.js';
import { TrailEntry } from '../kernel/trail/trail-entry.entity.js';

/** Every table's entity, listed explicitly so the DataSource needs no glob that differs between tsx and a build. */
import { MailOutbox } from '../features/notices/mail-outbox.entity.js';
import { AuthorityNotice } from '../features/notices/authority-notice.entity.js';
import { MailPreferenceRow } from '../kernel/mail/mail-preference.entity.js';
import { ApplicationSheet } from '../features/tools/application-sheet.entity.js';
import { TankCheck } from '../features/tools/tank-check.entity.js';

export const entities = [
  Company,
  Site,
  User,
  UserSite,
  Session,
  TrailEntry,
  TrailChainHead,
  StoredFile,
  DischargePoint,
  Parameter,
  Permit,
  PermitLimit,
  PermitSettings,
  LabCertificate,
  QcBatch,
  LabSample,
  LabResult,
  Equipment,
  OilLogEntry,
  UpkeepCheck,
  Shipment,
  ShipmentFile,
  FollowUp,
  FlowReading,
  ReportingPeriod,
  PeriodAmendment,
  PeriodSignature,
  ImportRun,
  MailOutbox,
  MailPreferenceRow,
  AuthorityNotice,
  ApplicationSheet,
  TankCheck,
];
