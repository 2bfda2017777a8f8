import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { freePort } from './lib/ports.js';
import { startCluster, stopCluster } from './lib/postgres.js';
import { ensureWebBuild } from './lib/web-build.js';

/**
 * npm test: the test cluster (.data/pg-test, a free port, fsync off), the web build the e2e suite
 * serves, then every vitest project in one run. Each suite creates and drops its own database.
 */
const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const log = (line: string) => console.log(`[test] ${line}`);
const outputDir = path.join(root, 'test-output');
fs.mkdirSync(path.join(root, '.data'), { recursive: true });
fs.mkdirSync(outputDir, { recursive: true });

removeAbandonedClusters(path.join(root, '.data'));
// One throwaway cluster per run, so that runs in parallel (two terminals, two checkouts) never meet.
const clusterDir = path.join(root, '.data', `pg-test-${process.pid}`);
const cluster = startCluster(clusterDir, await freePort(), { durable: false });
log(`test cluster on 127.0.0.1:${cluster.port}`);
let status: number;
try {
  // only the e2e suite serves the web app: a run of other projects does not wait for (or fail on) its build
  const args = process.argv.slice(2);
  const projects = args.flatMap((arg, i) =>
    arg === '--project' ? [args[i + 1]] : arg.startsWith('--project=') ? [arg.slice(10)] : [],
  );
  if (!projects.length || projects.includes('e2e')) ensureWebBuild(root, log);
  const reportFile = path.join(outputDir, `vitest-report-${process.pid}.json`);
  const result = spawnSync(
    process.execPath,
    [
      path.join(root, 'node_modules/vitest/vitest.mjs'),
      'run',
      '--reporter=default',
      '--reporter=json',
      `--outputFile.json=${reportFile}`,
      ...process.argv.slice(2),
    ],
    { cwd: root, stdio: 'inherit', env: { ...process.env, SHADOWLOOP_TEST_PG_URL: cluster.adminUrl() } },
  );
  status = result.status ?? 1;
  if (fs.existsSync(reportFile)) {
    const report = JSON.parse(fs.readFileSync(reportFile, 'utf8')) as {
      numPassedTests: number;
      numFailedTests: number;
      numPendingTests: number;
    };
    console.log(
      `\ntests: ${report.numPassedTests} passed, ${report.numFailedTests} failed, ${report.numPendingTests} skipped`,
    );
    fs.renameSync(reportFile, path.join(outputDir, 'vitest-report.json'));
  }
} finally {
  cluster.stop();
  fs.rmSync(clusterDir, { recursive: true, force: true });
  fs.rmSync(`${clusterDir}.password`, { force: true });
}
process.exit(status);

/** Test clusters left by runs that were killed: their owning process is gone. */
function removeAbandonedClusters(dataDir: string): void {
  for (const name of fs.readdirSync(dataDir)) {
    const pid = /^pg-(?:test|bench)-(\d+)$/.exec(name)?.[1];
    if (!pid || isAlive(Number(pid))) continue;
    try {
      stopCluster(path.join(dataDir, name));
    } catch {
      // already stopped
    }
    fs.rmSync(path.join(dataDir, name), { recursive: true, force: true });
    fs.rmSync(path.join(dataDir, `${name}.password`), { force: true });
  }
}

function isAlive(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch {
    return false;
  }
}
