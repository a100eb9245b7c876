import os from 'node:os';
import { Worker } from 'node:worker_threads';
import type { StudyParams } from '../../shared/schemas/index';

type Reply = { id: number; summary?: unknown; error?: string };
interface Task {
  id: number;
  params: StudyParams;
  resolve: (summary: unknown) => void;
  reject: (err: Error) => void;
}

/**
 * A small pool of worker threads running summary.worker.ts. Tasks queue when
 * every worker is busy; a worker that dies fails its task and is replaced.
 * Workers load TypeScript through tsx's API, under `tsx` and under Vitest alike.
 */
export function createSummaryPool(size = Math.max(1, Math.min(2, os.cpus().length - 1))) {
  const workerUrl = new URL('./summary.worker.ts', import.meta.url);
  // A tiny ESM bootstrap registers tsx inside the thread, then loads the TypeScript worker.
  const bootstrap = `import { register } from 'tsx/esm/api'; register(); await import(${JSON.stringify(workerUrl.href)});`;
  const idle: Worker[] = [];
  const busy = new Map<Worker, Task>();
  const queue: Task[] = [];
  let nextId = 1;
  let closed = false;

  const spawn = () => {
    const worker = new Worker(bootstrap, { eval: true });
    worker.unref();
    worker.on('message', (reply: Reply) => {
      const task = busy.get(worker);
      busy.delete(worker);
      if (task) {
        if (reply.error !== undefined) task.reject(new Error(reply.error));
        else task.resolve(reply.summary);
      }
      idle.push(worker);
      pump();
    });
    worker.on('error', (err) => {
      busy.get(worker)?.reject(err);
      busy.delete(worker);
    });
    worker.on('exit', () => {
      busy.get(worker)?.reject(new Error('summary worker exited'));
      busy.delete(worker);
      const i = idle.indexOf(worker);
      if (i >= 0) idle.splice(i, 1);
      if (!closed) {
        spawn();
        pump();
      }
    });
    idle.push(worker);
  };

  const pump = () => {
    while (idle.length && queue.length) {
      const worker = idle.pop()!;
      const task = queue.shift()!;
      busy.set(worker, task);
      worker.postMessage({ id: task.id, params: task.params });
    }
  };

  for (let i = 0; i < size; i++) spawn();

  return {
    run(params: StudyParams): Promise<unknown> {
      if (closed) return Promise.reject(new Error('summary pool is closed'));
      return new Promise((resolve, reject) => {
        queue.push({ id: nextId++, params, resolve, reject });
        pump();
      });
    },
    async close() {
      closed = true;
      const all = [...idle, ...busy.keys()];
      idle.length = 0;
      await Promise.all(all.map((w) => w.terminate()));
    },
  };
}

export type SummaryPool = ReturnType<typeof createSummaryPool>;
