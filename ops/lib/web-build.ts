import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';

function newestMtime(target: string): number {
  if (!fs.existsSync(target)) return 0;
  const stat = fs.statSync(target);
  if (!stat.isDirectory()) return stat.mtimeMs;
  return Math.max(stat.mtimeMs, ...fs.readdirSync(target).map((name) => newestMtime(path.join(target, name))));
}

/** Builds web/dist when it is missing or older than the web app's sources. */
export function ensureWebBuild(root: string, log: (line: string) => void): void {
  const builtAt = newestMtime(path.join(root, 'web/dist/index.html'));
  const sources = [
    'web/src',
    'web/index.html',
    'web/vite.config.ts',
    'web/package.json',
    'api/src/contracts',
    'simulator/src/events.ts',
  ];
  const changedAt = Math.max(...sources.map((s) => newestMtime(path.join(root, s))));
  if (builtAt > changedAt) return;
  log('building the web app (vite build)');
  const result = spawnSync('npm', ['run', '--silent', 'build', '-w', '@shadowloop/web'], {
    cwd: root,
    stdio: ['ignore', 'ignore', 'inherit'],
  });
  if (result.status !== 0) throw new Error('the web app did not build; see the output above');
}
