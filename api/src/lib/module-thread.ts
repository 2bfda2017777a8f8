import { createRequire } from 'node:module';
import path from 'node:path';
import { pathToFileURL } from 'node:url';
import { Worker } from 'node:worker_threads';

/**
 * Starts a worker thread on a module of this code base. The api runs its TypeScript sources
 * through tsx, and a worker thread does not inherit that loader, so for a `.ts` module the thread
 * first registers tsx's ESM hooks and then imports the module (compiled `.js` starts directly).
 */
export function startModuleThread(moduleUrl: URL, workerData: unknown): Worker {
  if (!moduleUrl.pathname.endsWith('.ts')) return new Worker(moduleUrl, { workerData });
  // tsx's ESM API (the "import" condition of its "./esm/api" export; require.resolve would give the CommonJS build)
  const tsxPackage = createRequire(import.meta.url).resolve('tsx/package.json');
  const tsx = pathToFileURL(path.join(path.dirname(tsxPackage), 'dist/esm/api/index.mjs')).href;
  const boot = `import(${JSON.stringify(tsx)}).then((api) => { api.register(); return import(${JSON.stringify(moduleUrl.href)}); })`;
  return new Worker(boot, { eval: true, workerData });
}

/** The URL of a module next to `importMetaUrl`, with the same extension (`.ts` from sources, `.js` compiled). */
export function siblingModule(importMetaUrl: string, baseName: string): URL {
  const extension = new URL(importMetaUrl).pathname.endsWith('.ts') ? 'ts' : 'js';
  return new URL(`./${baseName}.${extension}`, importMetaUrl);
}
