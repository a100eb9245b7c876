import fs from 'node:fs';
import path from 'node:path';
import { createRequire } from 'node:module';
import { pathToFileURL } from 'node:url';
import { Worker, type WorkerOptions } from 'node:worker_threads';

// A worker thread running a TypeScript module. The worker first registers tsx's ESM loader (located through
// tsx's own package.json exports, so this works under tsx and under Vitest alike), then imports the module.

let apiUrl: string | null = null;
function tsxEsmApiUrl(): string {
  if (apiUrl) return apiUrl;
  const require = createRequire(import.meta.url);
  const pkgPath = require.resolve('tsx/package.json');
  const pkg = JSON.parse(fs.readFileSync(pkgPath, 'utf8')) as { exports: Record<string, { import: { default: string } }> };
  apiUrl = pathToFileURL(path.join(path.dirname(pkgPath), pkg.exports['./esm/api'].import.default)).href;
  return apiUrl;
}

export function spawnTsWorker(moduleUrl: URL, options: Omit<WorkerOptions, 'eval'> = {}): Worker {
  const code = `import(${JSON.stringify(tsxEsmApiUrl())}).then((tsx) => { tsx.register(); return import(${JSON.stringify(moduleUrl.href)}); });`;
  return new Worker(code, { ...options, eval: true });
}
