import { createHash } from 'node:crypto';
import stableStringify from 'fast-json-stable-stringify';
import type { DataSource, EntityManager } from 'typeorm';
import type { CurrentUser } from '../../auth/current-user.js';
import { RECENT_AUTHENTICATION_MS } from '../../auth/session.js';
import type {
  AmendRequest,
  OpenAmendment,
  PeriodSummary,
  Revision,
  Signature,
  SignOffChecklist,
  SignRequest,
} from '../../contracts/periods.js';
import { certificationStatements } from '../../domain/period/certification.js';
import { revisionChanges } from '../../domain/period/revision-changes.js';
import { reportTimeliness } from '../../domain/report-timeliness.js';
import { AppError, conflict, invalid, notFound } from '../../errors/app-error.js';
import { recordTrail } from '../../kernel/trail/trail.js';
import type { PeriodRecord } from './period-input.repository.js';
import type { PeriodSignature } from './period-signature.entity.js';
import { findPeriod } from './periods.repository.js';
import {
  inputHashes,
  lockPeriodRow,
  openAmendmentOf,
  saveAmendment,
  saveSignature,
  signatureOf,
  signaturesOf,
  signOffItems,
  storedCompile,
  trailHead,
} from './sign-off.repository.js';
import { buildPeriodPack } from '../reports/period-pack.service.js';
import { summarise } from './summarise.js';
import { mailPeriodSigned } from '../notices/period-signed-mail.js';

const sha256 = (value: unknown) => createHash('sha256').update(stableStringify(value)).digest('hex');

/** The parts of a summary that are its figures: what a signature vouches for and a re-check compares. */
const figuresOf = (summary: PeriodSummary) =>
  stableStringify({
    rows: summary.rows,
    significantNoncompliance: summary.significantNoncompliance,
    nonDetectPolicy: summary.nonDetectPolicy,
    massLoadingFactor: summary.massLoadingFactor,
    oil: summary.oil,
    labFlagCount: summary.labFlagCount,
  });

function signatureView(signature: PeriodSignature): Signature {
  return {
    revision: signature.revision,
    signerName: signature.signerName,
    signerTitle: signature.signerTitle,
    signedAt: signature.signedAt.toISOString(),
    statementSection: signature.statementSection,
    sha256: signature.sha256,
    trailHead: { seq: String(signature.trailHeadSeq), hash: signature.trailHeadHash },
    amendmentReason: signature.amendment?.reason ?? null,
    packSha256: signature.packSha256,
    packXlsxSha256: signature.packXlsxSha256,
  };
}

const reauthenticationRequired = (periodId: string) =>
  new AppError(401, 'reauthentication_required', 'Sign in again to sign: your last sign-in was more than 15 minutes ago', undefined, {
    signInUrl: `/api/auth/sign-in?reauthenticate=1&returnTo=${encodeURIComponent(`/periods/${periodId}?sign=1`)}`,
  });

/**
 * The life of a period after its draft: signing (a frozen snapshot with the hashes of its
 * inputs), amending with a reason, and reading its revisions. PostgreSQL holds the lock on the
 * inputs of a signed period (migration PeriodSignOff); this service answers what the lock means.
 */
export class PeriodSignOffService {
  constructor(private readonly dataSource: DataSource) {}

  /**
   * What a period's page shows: a signed period's snapshot, never a live compile; otherwise a
   * draft compiled now, with the last signature and the open amendment where there are.
   */
  async view(period: PeriodRecord): Promise<PeriodSummary> {
    const signatures = period.revision > 0 ? await signaturesOf(this.dataSource, period.id) : [];
    const last = signatures.at(-1);
    // When the report went to the authority is recorded after signing: the one live part.
    const timeliness = reportTimeliness(period.dueOn, period.submittedOn, period.today, period.lateReportDays, period.permitKind);
    if (period.status === 'signed' && last) {
      return {
        ...last.summary,
        status: 'signed',
        revision: last.revision,
        signature: signatureView(last),
        amendment: null,
        reportTimeliness: timeliness,
      };
    }
    const draft = await summarise(this.dataSource, period);
    const amendment = period.status === 'amended' ? await openAmendmentOf(this.dataSource, period.id, period.revision) : null;
    return {
      ...draft,
      signature: last ? signatureView(last) : null,
      amendment: amendment ? amendmentView(amendment) : null,
    };
  }

  async checklist(user: CurrentUser, period: PeriodRecord, authenticatedAt: number): Promise<SignOffChecklist> {
    const statement = certificationStatements[period.permitKind];
    const stored = await storedCompile(this.dataSource, period.id);
    const items = stored.summary ? await signOffItems(this.dataSource, period, stored.summary) : [];
    return {
      canSign: notSignable(period) === null,
      reasonNotSignable: notSignable(period),
      statementSection: `${statement.section} (required by ${statement.requiredBy})`,
      statement: statement.text,
      items,
      compiledAt: stored.summary?.compiledAt ?? null,
      recentSignInRequired: Date.now() - authenticatedAt > RECENT_AUTHENTICATION_MS,
    };
  }

  async sign(user: CurrentUser, period: PeriodRecord, request: SignRequest, authenticatedAt: number): Promise<PeriodSummary> {
    const reason = notSignable(period);
    if (reason) throw conflict(reason);
    if (Date.now() - authenticatedAt > RECENT_AUTHENTICATION_MS) throw reauthenticationRequired(period.id);
    await this.dataSource.transaction((manager) => signWithin(manager, user, period, request));
    return this.view((await findPeriod(this.dataSource, period.id))!);
  }

  async amend(user: CurrentUser, period: PeriodRecord, request: AmendRequest): Promise<PeriodSummary> {
    await this.dataSource.transaction((manager) => amendWithin(manager, user, period, request));
    return this.view((await findPeriod(this.dataSource, period.id))!);
  }

  /** Every signed revision, newest first, with what changed from the one before. */
  async revisions(period: PeriodRecord): Promise<Revision[]> {
    const signatures = await signaturesOf(this.dataSource, period.id);
    return signatures
      .map((signature, i) => ({
        ...signatureView(signature),
        changes: i === 0 ? null : revisionChanges(signatures[i - 1]!.summary, signature.summary),
      }))
      .reverse();
  }

  /** One revision exactly as it was signed. */
  async revision(period: PeriodRecord, revision: number): Promise<PeriodSummary> {
    const signature = await signatureOf(this.dataSource, period.id, revision);
    if (!signature) throw notFound('Revision');
    return { ...signature.summary, status: 'signed', revision: signature.revision, signature: signatureView(signature), amendment: null };
  }
}

/** Who signs or amends: the signed-in person, or the demo seed acting for the demo coordinator. */
type Signatory = Pick<CurrentUser, 'id' | 'email' | 'name'>;

/**
 * Signs a period inside the caller's transaction: the reviewed compile must still be what the
 * records give, the listed items acknowledged; the snapshot (summary, input hashes, statement,
 * signer, trail head) is stored with its SHA-256 and the period becomes signed.
 */
export async function signWithin(manager: EntityManager, user: Signatory, period: PeriodRecord, request: SignRequest): Promise<void> {
  const statement = certificationStatements[period.permitKind];
  const row = await lockPeriodRow(manager, period.id);
  if (row.status === 'signed') throw conflict('This period is already signed');
  const reviewed = row.summary as PeriodSummary | null;
  if (!reviewed || new Date(reviewed.compiledAt).getTime() !== new Date(request.compiledAt).getTime()) {
    throw conflict('The period was compiled again since the summary you reviewed: review the new compile, then sign', {
      compiledAt: 'Not the latest compile',
    });
  }
  const shown = reviewed;
  const now = await summarise(manager, { ...period, status: row.status });
  if (figuresOf(now) !== figuresOf(shown)) {
    throw conflict('The records changed since the summary was compiled: compile again, review, then sign', {
      compiledAt: 'The records changed since',
    });
  }
  const items = await signOffItems(manager, period, shown);
  if (items.length > 0 && !request.acknowledged) {
    throw invalid({ acknowledged: `Acknowledge the ${items.length} finding(s), missed sample(s) and open follow-up(s) listed` });
  }
  const amendment = row.status === 'amended' ? await openAmendmentOf(manager, period.id, row.revision) : null;
  const signature = {
    periodId: period.id,
    revision: row.revision + 1,
    amendmentId: amendment?.id ?? null,
    signedBy: user.id,
    signerName: request.signerName,
    signerTitle: request.signerTitle,
    signedAt: new Date(),
    statementSection: statement.section,
    statement: statement.text,
    acknowledged: items,
    acknowledgementNote: request.acknowledgementNote,
    summary: shown,
    inputs: await inputHashes(manager, period),
    ...(await trailHead(manager).then((head) => ({ trailHeadSeq: head.seq, trailHeadHash: head.hash }))),
  };
  const sha = sha256({ ...signature, signedAt: signature.signedAt.toISOString(), signerEmail: user.email });
  // The pack is built now, as signed, and kept with the signature: the same file for good.
  const pack = await buildPeriodPack(manager, period, {
    ...shown,
    status: 'signed',
    revision: signature.revision,
    amendment: null,
    signature: {
      revision: signature.revision,
      signerName: signature.signerName,
      signerTitle: signature.signerTitle,
      signedAt: signature.signedAt.toISOString(),
      statementSection: signature.statementSection,
      sha256: sha,
      trailHead: { seq: String(signature.trailHeadSeq), hash: signature.trailHeadHash },
      amendmentReason: amendment?.reason ?? null,
      packSha256: null,
      packXlsxSha256: null,
    },
  });
  const hex = (bytes: Buffer) => createHash('sha256').update(bytes).digest('hex');
  await saveSignature(manager, {
    ...signature,
    sha256: sha,
    packPdf: pack.pdf,
    packSha256: hex(pack.pdf),
    packXlsx: pack.xlsx,
    packXlsxSha256: hex(pack.xlsx),
  });
  await recordTrail(manager, user, {
    action: 'sign',
    entity: 'reporting-period',
    entityId: period.id,
    siteId: period.siteId,
    before: { status: row.status, revision: row.revision },
    after: {
      status: 'signed',
      revision: signature.revision,
      sha256: sha,
      signerName: request.signerName,
      signerTitle: request.signerTitle,
    },
  });
  await mailPeriodSigned(manager, period, { revision: signature.revision, signerName: request.signerName });
}

/** Opens an amendment on a signed period inside the caller's transaction; its inputs unlock for it. */
export async function amendWithin(manager: EntityManager, user: Signatory, period: PeriodRecord, request: AmendRequest): Promise<string> {
  const row = await lockPeriodRow(manager, period.id);
  if (row.status !== 'signed') throw conflict('Only a signed period is amended; this one is not signed');
  const amendment = await saveAmendment(manager, {
    periodId: period.id,
    amendsRevision: row.revision,
    reason: request.reason,
    openedBy: user.id,
    openedByName: user.name,
  });
  await recordTrail(manager, user, {
    action: 'amend',
    entity: 'reporting-period',
    entityId: period.id,
    siteId: period.siteId,
    before: { status: 'signed', revision: row.revision },
    after: { status: 'amended', amendmentId: amendment.id, reason: request.reason },
  });
  return amendment.id;
}

/** Why a period cannot be signed now, or null. */
function notSignable(period: PeriodRecord): string | null {
  if (period.endsOn >= period.today) return `The period ends on ${period.endsOn}: it can be signed once it is over`;
  if (period.status === 'signed') return `Already signed (revision ${period.revision}); open an amendment to change it`;
  return null;
}

function amendmentView(amendment: {
  id: string;
  amendsRevision: number;
  reason: string;
  openedByName: string;
  openedAt: Date;
}): OpenAmendment {
  return {
    id: amendment.id,
    amendsRevision: amendment.amendsRevision,
    reason: amendment.reason,
    openedByName: amendment.openedByName,
    openedAt: amendment.openedAt.toISOString(),
  };
}
