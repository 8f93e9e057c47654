/**
 * Run by the sign-in flood bench case in its own process: keeps argv[3] wrong sign-ins in flight
 * against argv[2] (the API base URL), all from one address (X-Forwarded-For: 203.0.113.66, which
 * the app trusts from loopback), each answered one starting the next. Prints "flooding" once the
 * first answers are in, and on SIGTERM one JSON line counting the answers by status.
 */
const [base, parallelArg] = process.argv.slice(2);
const parallel = Number(parallelArg ?? 50);
const counts: Record<string, number> = {};
let stopping = false;
let announced = false;

async function one(i: number): Promise<void> {
  while (!stopping) {
    try {
      const res = await fetch(`${base}/auth/login`, {
        method: 'POST',
        headers: { 'content-type': 'application/json', 'x-forwarded-for': '203.0.113.66' },
        body: JSON.stringify({ email: 'admin@fieldfile.test', password: `guess-${i}-${Math.random().toString(36).slice(2)}` }),
      });
      const body = (await res.json()) as { error?: { code?: string } };
      const key = `${res.status}${body.error?.code ? ` ${body.error.code}` : ''}`;
      counts[key] = (counts[key] ?? 0) + 1;
      if (!announced) {
        announced = true;
        console.log('flooding');
      }
    } catch {
      counts.error = (counts.error ?? 0) + 1;
    }
  }
}

// The parent holds our stdin: when it goes away (ended or crashed), so do we.
process.stdin.on('close', () => process.exit(0));
process.stdin.resume();
process.on('SIGTERM', () => {
  stopping = true;
  console.log(JSON.stringify(counts));
  process.exit(0);
});
for (let i = 0; i < parallel; i++) void one(i);
