/** Small process helpers shared by start.ts and dev.ts. */
import { spawn, spawnSync, type ChildProcess, type SpawnOptions } from 'node:child_process';

export function runOrExit(command: string, args: string[], label: string, env: NodeJS.ProcessEnv = process.env) {
  const result = spawnSync(command, args, { stdio: 'inherit', env });
  if (result.status !== 0) {
    console.error(`${label} failed (exit ${result.status ?? result.signal}).`);
    process.exit(result.status ?? 1);
  }
}

/** Starts a long-running child; when any child exits the whole group stops. */
export function supervise(children: { name: string; command: string; args: string[]; options?: SpawnOptions }[]) {
  const running: ChildProcess[] = [];
  let stopping = false;
  const stopAll = (code: number) => {
    if (stopping) return;
    stopping = true;
    for (const child of running) if (child.exitCode === null) child.kill('SIGTERM');
    setTimeout(() => process.exit(code), 300).unref();
  };
  for (const c of children) {
    const child = spawn(c.command, c.args, { stdio: 'inherit', ...c.options });
    child.on('exit', (code, signal) => {
      if (!stopping) console.error(`${c.name} stopped (${code ?? signal}); stopping the rest.`);
      stopAll(code ?? 1);
    });
    running.push(child);
  }
  process.on('SIGINT', () => stopAll(0));
  process.on('SIGTERM', () => stopAll(0));
  return stopAll;
}
