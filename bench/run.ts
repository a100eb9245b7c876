/**
 * `npm run bench`: every figure the issues set, measured on this machine.
 * Not part of the test suite. Each bench module exports one async function
 * returning its figures; this runner prints them together.
 */
import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import path from 'node:path';

type Figures = Record<string, number | string>;
type Bench = { name: string; file: string; exportName: string };

const here = path.dirname(fileURLToPath(import.meta.url));

const benches: Bench[] = [
  { name: 'solver (reference study, scaling)', file: 'solver.ts', exportName: 'runSolverBench' },
  { name: 'viscoelastic recursion vs hereditary integral', file: 'viscoelastic.ts', exportName: 'runViscoelasticBench' },
  { name: 'run-log parse, check and replay', file: 'run-log.ts', exportName: 'runRunLogBench' },
  { name: 'API reads and saves under load (real MariaDB)', file: 'api.ts', exportName: 'runApiBench' },
];

async function main(): Promise<void> {
  const only = process.argv[2];
  for (const bench of benches) {
    if (only && !bench.file.startsWith(only)) continue;
    const file = path.join(here, bench.file);
    if (!existsSync(file)) {
      console.log(`\n## ${bench.name}\n(not yet built: bench/${bench.file} does not exist)`);
      continue;
    }
    const mod = (await import(file)) as Record<string, () => Promise<Figures>>;
    const figures = await mod[bench.exportName]();
    console.log(`\n## ${bench.name}`);
    console.table(figures);
  }
}

main().catch((error) => {
  console.error(error);
  process.exit(1);
});
