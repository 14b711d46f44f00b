import { spawnSync } from 'node:child_process';
import { createServer } from 'node:net';

function isFree(port: number, host: string): Promise<boolean> {
  return new Promise((resolve) => {
    const probe = createServer();
    probe.once('error', () => resolve(false));
    probe.listen(port, host, () => probe.close(() => resolve(true)));
  });
}

/** What `ss` says listens on a port (process name and pid), when it can say. */
function holderOf(port: number): string {
  const result = spawnSync('ss', ['-ltnpH', `sport = :${port}`], { encoding: 'utf8' });
  const users = /users:\(\((.*?)\)\)/.exec(result.stdout ?? '')?.[1];
  return users ? ` (held by ${users})` : '';
}

/**
 * Waits until every port is free: after a crash, the previous run's processes may still be
 * shutting down. Gives up after `timeoutMs`, naming what holds each port still taken.
 */
export async function waitForFreePorts(ports: Array<{ port: number; name: string }>, host: string, timeoutMs = 20_000): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  let announced = false;
  for (;;) {
    const taken = [];
    for (const entry of ports) if (!(await isFree(entry.port, host))) taken.push(entry);
    if (taken.length === 0) return;
    if (Date.now() > deadline) {
      const lines = taken.map((entry) => `  port ${entry.port} (${entry.name})${holderOf(entry.port)}`);
      throw new Error(`These ports are still in use; stop what holds them, or set other ports:\n${lines.join('\n')}`);
    }
    if (!announced) {
      console.log(`Waiting for ${taken.map((entry) => `port ${entry.port} (${entry.name})`).join(', ')} to be free…`);
      announced = true;
    }
    await new Promise((resolve) => setTimeout(resolve, 500));
  }
}
