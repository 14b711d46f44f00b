import { spawn, spawnSync, type ChildProcess, type SpawnOptions } from 'node:child_process';

/** Runs a command to completion, echoing its output; throws when it fails. */
export function run(command: string, args: string[], options: SpawnOptions = {}): void {
  const result = spawnSync(command, args, { stdio: 'inherit', ...options });
  if (result.status !== 0) {
    throw new Error(`${command} ${args.join(' ')} failed with ${result.status ?? result.signal}`);
  }
}

/** Runs a command and returns its exit code without throwing. */
export function runStatus(command: string, args: string[], options: SpawnOptions = {}): number {
  return spawnSync(command, args, { stdio: 'ignore', ...options }).status ?? 1;
}

const children: ChildProcess[] = [];

/** Starts a TypeScript entry point in its own Node process, with the server's tsconfig. */
export function startTypeScript(entry: string, env: NodeJS.ProcessEnv, extraNodeArgs: string[] = []): ChildProcess {
  const child = spawn(process.execPath, [...extraNodeArgs, '--import', 'tsx', entry], {
    stdio: 'inherit',
    env: { ...process.env, TSX_TSCONFIG_PATH: 'server/tsconfig.json', ...env },
  });
  children.push(child);
  return child;
}

export function startCommand(command: string, args: string[], env: NodeJS.ProcessEnv): ChildProcess {
  const child = spawn(command, args, { stdio: 'inherit', env: { ...process.env, ...env } });
  children.push(child);
  return child;
}

export async function stopChildren(): Promise<void> {
  await Promise.all(
    children.map(
      (child) =>
        new Promise<void>((resolve) => {
          if (child.exitCode !== null || child.signalCode !== null) return resolve();
          const timer = setTimeout(() => child.kill('SIGKILL'), 5000);
          child.once('exit', () => {
            clearTimeout(timer);
            resolve();
          });
          child.kill('SIGTERM');
        }),
    ),
  );
}
