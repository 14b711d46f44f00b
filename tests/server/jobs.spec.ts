import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startJobs, type JobHandlers, type RunningJobs } from '../../server/kernel/jobs/jobs.js';
import { queues, type QueueName } from '../../server/kernel/jobs/queues.js';
import { queueMail } from '../../server/kernel/mail/outbox.js';
import { siteRecipients } from '../../server/kernel/mail/recipients.js';
import { demoIds } from '../fixtures/lab.js';
import { startTestApp, type TestApp } from '../helpers/test-app.js';
import { testAppDatabaseUrl } from '../helpers/test-env.js';

/**
 * Two app instances against one database, as behind a load balancer: a job is worked by one of
 * them, once; the schedules are stored once; a committed mail wakes the delivery job at once.
 * Run as the app's own role, which may use the job queue but not alter it.
 */
describe('jobs across instances', () => {
  let t: TestApp;
  const calls: Array<{ instance: string; queue: QueueName; data: object }> = [];
  const runners: RunningJobs[] = [];
  const handlersOf = (instance: string) =>
    Object.fromEntries(
      Object.values(queues).map((queue) => [queue, async (data: object) => void calls.push({ instance, queue, data })]),
    ) as JobHandlers;

  beforeAll(async () => {
    t = await startTestApp();
    runners.push(await startJobs(testAppDatabaseUrl, handlersOf('a')), await startJobs(testAppDatabaseUrl, handlersOf('b')));
  });
  afterAll(async () => {
    await Promise.all(runners.map((runner) => runner.stop()));
    await t.close();
  });

  const waitFor = async (check: () => boolean, ms = 8000) => {
    const until = Date.now() + ms;
    while (!check() && Date.now() < until) await new Promise((resolve) => setTimeout(resolve, 100));
  };

  it('works a job on one instance only, once', async () => {
    const marker = `once-${Date.now()}`;
    await runners[0]!.boss.send(queues.createPeriods, { marker });
    await waitFor(() => calls.some((call) => (call.data as { marker?: string }).marker === marker));
    // Both instances poll every 2 s: wait past two more polls for a second run that must not come.
    await new Promise((resolve) => setTimeout(resolve, 4500));
    expect(calls.filter((call) => (call.data as { marker?: string }).marker === marker)).toHaveLength(1);
  });

  it('stores each schedule once, however many instances start', async () => {
    const rows: Array<{ name: string; n: number }> = await t.dataSource.query(
      `SELECT name, count(*)::int AS n FROM pgboss.schedule GROUP BY name ORDER BY name`,
    );
    expect(rows).toEqual(
      Object.values(queues)
        .sort()
        .map((name) => ({ name, n: 1 })),
    );
  });

  it('wakes the delivery job when a mail is committed', async () => {
    const before = calls.filter((call) => call.queue === queues.deliverMail).length;
    const ids = await demoIds(t.dataSource);
    const people = await siteRecipients(t.dataSource, ids.north, ['coordinator']);
    await t.dataSource.transaction((manager) =>
      queueMail(
        manager,
        {
          eventKey: `test:wake-${Date.now()}`,
          kind: 'deadline',
          content: { subject: 'Wake test', lines: ['x'], path: '/', linkText: 'Open' },
        },
        people,
      ),
    );
    await waitFor(() => calls.filter((call) => call.queue === queues.deliverMail).length > before);
    expect(calls.filter((call) => call.queue === queues.deliverMail).length).toBeGreaterThan(before);
  });

  it('creates each scheduled job once a minute however many instances keep the clock', async () => {
    // The delivery job is scheduled every minute: wait for the clock to fire at least once.
    const scheduledRuns = () => calls.filter((call) => (call.data as { scheduled?: string }).scheduled === queues.deliverMail);
    await waitFor(() => scheduledRuns().length > 0, 100_000);
    expect(scheduledRuns().length).toBeGreaterThan(0);
    const perMinute: Array<{ n: number }> = await t.dataSource.query(
      `SELECT count(*)::int AS n FROM pgboss.job WHERE name = $1 AND data->>'scheduled' = $1 GROUP BY date_trunc('minute', created_on)`,
      [queues.deliverMail],
    );
    expect(perMinute.length).toBeGreaterThan(0);
    expect(perMinute.every((minute) => minute.n === 1)).toBe(true);
  }, 120_000);
});
