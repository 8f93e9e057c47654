/**
 * `npm run bench` — times every case in tests/bench/cases against its target and prints mean and
 * p95 per call. A benchmark, not a test: it always exits 0 unless a case throws.
 *   npm run bench -- <filter>   runs only the cases whose name contains <filter>
 */
import '../../server/runtime-flags'; // first: the same V8 flags as the server
import os from 'node:os';
import { benchCases } from './cases';
import { formatResult, runCase } from './harness';

const filter = process.argv[2];
const cases = filter ? benchCases.filter((c) => c.name.includes(filter)) : benchCases;

console.log(
  `Node ${process.version}, ${os.cpus().length} × ${os.cpus()[0]?.model ?? 'cpu'}, load average ${os
    .loadavg()
    .map((l) => l.toFixed(2))
    .join(' ')} ` + '(figures are only comparable on an otherwise idle machine)',
);
async function main() {
  for (const c of cases) {
    const result = await runCase(c);
    console.log(formatResult(result));
    for (const line of c.describe?.() ?? []) console.log(`      ${line}`);
  }
  // The session store's cleanup timer and the mail catcher must not keep the process alive.
  process.exit(0);
}
void main();
