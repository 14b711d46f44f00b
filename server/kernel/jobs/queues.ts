import PgBoss from 'pg-boss';

/** The app's jobs: each runs on one instance at a time, whichever takes it first. */
export const queues = {
  createPeriods: 'create-periods',
  dropStaleUploads: 'drop-stale-uploads',
  deadlineSweep: 'deadline-sweep',
  deliverMail: 'deliver-mail',
  dailyDigest: 'daily-digest',
} as const;
export type QueueName = (typeof queues)[keyof typeof queues];

/**
 * pg-boss's own queue through which its cron clock sends scheduled jobs: created at start by
 * whoever starts it, which the app's role cannot, and pg-boss ignores that failure silently.
 */
const CRON_QUEUE = '__pgboss__send-it';

/** When each runs (cron, UTC). */
export const schedules: Record<QueueName, string> = {
  'create-periods': '0 * * * *',
  'drop-stale-uploads': '30 * * * *',
  'deadline-sweep': '*/10 * * * *',
  'deliver-mail': '* * * * *',
  // Hourly: each person gets it at 07:00 in their site's zone (features/notices/daily-digest.ts).
  'daily-digest': '0 * * * *',
};

/**
 * Creates the queues as the database owner (a queue is a table partition, which the app's role
 * may not create). Run by database preparation, after the migrations.
 */
export async function ensureQueues(ownerUrl: string): Promise<void> {
  const boss = new PgBoss({ connectionString: ownerUrl, schema: 'pgboss', max: 2, supervise: false, schedule: false, migrate: true });
  boss.on('error', (error) => console.error('Job queue:', error));
  await boss.start();
  try {
    for (const name of [...Object.values(queues), CRON_QUEUE]) if (!(await boss.getQueue(name))) await boss.createQueue(name);
  } finally {
    await boss.stop({ graceful: false, wait: true });
  }
}
