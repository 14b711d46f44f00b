import pg from 'pg';
import PgBoss from 'pg-boss';
import { queues, schedules, type QueueName } from './queues.js';

export type JobHandlers = Record<QueueName, (data: object) => Promise<unknown>>;

export interface RunningJobs {
  boss: PgBoss;
  stop(): Promise<void>;
}

/**
 * Starts the job runner of one app instance: the schedules (stored in the database, so however
 * many instances run, each scheduled job is created and worked once) and a worker per queue.
 * A committed mail in the outbox wakes the delivery job at once (NOTIFY on insert).
 */
export async function startJobs(databaseUrl: string, handlers: JobHandlers): Promise<RunningJobs> {
  const boss = new PgBoss({ connectionString: databaseUrl, schema: 'pgboss', max: 4, migrate: false });
  boss.on('error', (error) => console.error('Job queue:', error));
  await boss.start();
  for (const [name, cron] of Object.entries(schedules)) await boss.schedule(name, cron, { scheduled: name }, { singletonKey: name });
  for (const name of Object.values(queues)) {
    await boss.work(name, { pollingIntervalSeconds: 2 }, async (jobs) => {
      for (const job of jobs) await handlers[name]((job.data ?? {}) as object);
    });
  }
  const listener = new pg.Client({ connectionString: databaseUrl });
  await listener.connect();
  listener.on('notification', () => void boss.send(queues.deliverMail, {}, { singletonKey: 'wake' }).catch(() => undefined));
  listener.on('error', (error) => console.error('Mail wake-up listener:', error));
  await listener.query('LISTEN decant_mail');
  return {
    boss,
    async stop() {
      await listener.end().catch(() => undefined);
      await boss.stop({ graceful: true, wait: true, timeout: 10_000 });
    },
  };
}
