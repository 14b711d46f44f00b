import type { DataSource, EntityManager } from 'typeorm';
import type { ImportRunStatus, ImportRunView } from '../../contracts/imports.js';
import { AppError, conflict } from '../../errors/app-error.js';
import { ImportRun } from './import-run.entity.js';

/** How long one import may run, reading to commit; past it, it stops and writes nothing. */
export const IMPORT_TIME_LIMIT_MS = 5 * 60 * 1000;
/** Progress is written at most this often: a run of 20,000 rows does not write 20,000 times. */
const PROGRESS_EVERY_MS = 250;

export const importTimedOut = (limitMs: number) =>
  new AppError(
    422,
    'import_timed_out',
    `The import took longer than ${Math.round(limitMs / 1000)} s and was stopped; nothing was written`,
    {
      file: 'Too much to import at once: split the file and import the parts',
    },
  );

/**
 * One import's run, tracked beside its transaction (on the data source, never the import's
 * manager) so its progress is visible while the import's writes are not yet committed. A run
 * without an id (a dry run through the API without one) is tracked in memory only.
 */
export class ImportRunTracker {
  private readonly deadline: number;
  private lastWrite = 0;

  private constructor(
    private readonly dataSource: DataSource,
    readonly id: string | undefined,
    readonly limitMs: number,
  ) {
    this.deadline = Date.now() + limitMs;
  }

  static async start(
    dataSource: DataSource,
    run: { id?: string; siteId: string; userId: string; kind: string; fileName: string },
    limitMs = IMPORT_TIME_LIMIT_MS,
  ): Promise<ImportRunTracker> {
    if (run.id) {
      const inserted = await dataSource
        .getRepository(ImportRun)
        .createQueryBuilder()
        .insert()
        .values({ id: run.id, siteId: run.siteId, userId: run.userId, kind: run.kind, fileName: run.fileName.slice(0, 255) })
        .orIgnore()
        .execute();
      if (inserted.identifiers.length === 0 || inserted.raw.length === 0)
        throw conflict('This import run id is taken: start a new run', { runId: 'Taken' });
    }
    return new ImportRunTracker(dataSource, run.id, limitMs);
  }

  /** Time left before the limit, in ms; throws once it is past. */
  remainingMs(): number {
    const left = this.deadline - Date.now();
    if (left <= 0) throw importTimedOut(this.limitMs);
    return left;
  }

  /** Cuts the import's own statements off at the limit too. */
  async limitStatements(manager: EntityManager): Promise<void> {
    await manager.query(`SET LOCAL statement_timeout = ${Math.max(1, Math.floor(this.remainingMs()))}`);
  }

  async progress(status: ImportRunStatus, rowsDone: number, rowsTotal: number, force = false): Promise<void> {
    this.remainingMs();
    if (!this.id || (!force && Date.now() - this.lastWrite < PROGRESS_EVERY_MS)) return;
    this.lastWrite = Date.now();
    await this.dataSource.getRepository(ImportRun).update({ id: this.id }, { status, rowsDone, rowsTotal });
  }

  async finish(status: 'done' | 'failed', message: string | null = null): Promise<void> {
    if (!this.id) return;
    await this.dataSource
      .getRepository(ImportRun)
      .createQueryBuilder()
      .update()
      .set({ status, message, finishedAt: () => 'now()', ...(status === 'done' ? { rowsDone: () => 'rows_total' } : {}) })
      .where('id = :id', { id: this.id })
      .execute();
  }

  /**
   * Runs `work` as this import: a statement timeout inside, the run marked done or failed after,
   * and a database timeout turned into the time-limit answer (the transaction rolled back).
   */
  async run<T>(work: () => Promise<T>): Promise<T> {
    try {
      const result = await work();
      await this.finish('done');
      return result;
    } catch (error) {
      const timedOut = (error as { code?: string })?.code === '57014';
      const answer = timedOut ? importTimedOut(this.limitMs) : error;
      await this.finish('failed', answer instanceof Error ? answer.message : 'Failed').catch(() => undefined);
      throw answer;
    }
  }
}

/** A run as its owner sees it; a run left unfinished past its limit (a restart) reads as failed. */
export function importRunView(run: ImportRun, limitMs = IMPORT_TIME_LIMIT_MS): ImportRunView {
  const abandoned = !run.finishedAt && Date.now() - run.startedAt.getTime() > limitMs + 60_000;
  return {
    id: run.id,
    kind: run.kind,
    fileName: run.fileName,
    status: abandoned ? 'failed' : run.status,
    rowsTotal: run.rowsTotal,
    rowsDone: run.rowsDone,
    message: abandoned
      ? 'Stopped before it finished (the app restarted or the run passed its time limit); nothing was written'
      : run.message,
    startedAt: run.startedAt.toISOString(),
    finishedAt: run.finishedAt?.toISOString() ?? null,
    timeLimitSeconds: Math.round(limitMs / 1000),
  };
}

export const findImportRun = (db: DataSource | EntityManager, id: string) => db.getRepository(ImportRun).findOneBy({ id });
