import { spawn, type ChildProcess } from 'node:child_process';
import readline from 'node:readline';

export interface Service {
  name: string;
  child: ChildProcess;
}

/** Starts a TypeScript entry point under tsx, prefixing its output with the service name. */
export function startService(name: string, entry: string, env: NodeJS.ProcessEnv, cwd: string): Service {
  const child = spawn(process.execPath, ['--import', 'tsx', entry], {
    cwd,
    env: { ...process.env, ...env },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  for (const stream of [child.stdout, child.stderr]) {
    readline.createInterface({ input: stream }).on('line', (line) => console.log(`[${name}] ${line}`));
  }
  return { name, child };
}

/** SIGTERM to every service, SIGKILL to those still running after graceMs. */
export async function stopServices(services: Service[], graceMs: number): Promise<void> {
  const running = services.filter((s) => s.child.exitCode === null && s.child.signalCode === null);
  await Promise.all(
    running.map(
      (s) =>
        new Promise<void>((resolve) => {
          const timer = setTimeout(() => {
            s.child.kill('SIGKILL');
          }, graceMs);
          s.child.once('exit', () => {
            clearTimeout(timer);
            resolve();
          });
          s.child.kill('SIGTERM');
        }),
    ),
  );
}

/** Polls a URL until it answers 200 or the time runs out. */
export async function waitForHttp(url: string, timeoutMs: number): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    try {
      const response = await fetch(url, { signal: AbortSignal.timeout(2000) });
      if (response.ok) return;
    } catch {
      // not up yet
    }
    if (Date.now() > deadline) throw new Error(`${url} did not answer within ${timeoutMs / 1000} s`);
    await new Promise((r) => setTimeout(r, 250));
  }
}
