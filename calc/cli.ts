/**
 * JSON command line for the calculation registry.
 *   npx tsx calc/cli.ts <name>   reads one JSON object on stdin, prints one JSON object on stdout
 *   npx tsx calc/cli.ts --list   prints every calculation with its input JSON Schema
 * Exit codes: 0 ok, 2 invalid input (schema or validity range), 1 usage error.
 */
import { listCalculations, runCalculation } from './registry';

async function readStdin(): Promise<string> {
  const chunks: Buffer[] = [];
  for await (const chunk of process.stdin) chunks.push(chunk as Buffer);
  return Buffer.concat(chunks).toString('utf8');
}

function print(value: unknown) {
  process.stdout.write(`${JSON.stringify(value, null, 2)}\n`);
}

async function main(argv: string[]): Promise<number> {
  const [arg] = argv;
  if (!arg || arg === '--help' || arg === '-h') {
    process.stderr.write('usage: calc/cli.ts <name> < input.json | calc/cli.ts --list\n');
    return arg ? 0 : 1;
  }
  if (arg === '--list') {
    print({ calculations: listCalculations() });
    return 0;
  }
  const text = await readStdin();
  let raw: unknown;
  try {
    raw = text.trim() === '' ? {} : JSON.parse(text);
  } catch (err) {
    print({ error: { message: `stdin is not valid JSON: ${(err as Error).message}`, issues: [{ path: [], message: 'invalid JSON' }] } });
    return 2;
  }
  const outcome = runCalculation(arg, raw);
  if (outcome.ok) {
    print(outcome.result);
    return 0;
  }
  print({ error: outcome.error });
  return 2;
}

main(process.argv.slice(2)).then(
  (code) => {
    process.exitCode = code;
  },
  (err) => {
    process.stderr.write(`${(err as Error).stack ?? err}\n`);
    process.exitCode = 1;
  },
);
