/**
 * HTTP load from a process of its own (so the client does not share the server's event loop):
 * GET one URL over N keep-alive connections, either as fast as the server answers (closed loop:
 * each connection sends its next request when the last one is answered) or at a fixed rate
 * (open loop: latency counted from the moment each request was due, so a slow answer that
 * delays the next ones is counted, not hidden).
 *   argv[2]: JSON { url, cookie?, connections, durationMs, warmupMs, ratePerSecond? }
 * Prints one JSON line: { requests, errors, perSecond, p50Ms, p95Ms, p99Ms, statuses }.
 */
import http from 'node:http';

const { url, cookie, connections, durationMs, warmupMs = 0, ratePerSecond } = JSON.parse(process.argv[2]);
const agent = new http.Agent({ keepAlive: true, maxSockets: connections });
const headers = cookie ? { cookie } : {};
const target = new URL(url);

function get() {
  return new Promise((resolve) => {
    const req = http.request({ agent, host: target.hostname, port: target.port, path: target.pathname + target.search, headers }, (res) => {
      res.on('data', () => {});
      res.on('end', () => resolve(res.statusCode ?? 0));
    });
    req.on('error', () => resolve(0));
    req.end();
  });
}

const now = () => Number(process.hrtime.bigint()) / 1e6;
const latenciesMs = [];
const statuses = {};
let counting = false;

function record(status, ms) {
  if (!counting) return;
  statuses[status] = (statuses[status] ?? 0) + 1;
  latenciesMs.push(ms);
}

async function closedLoop(until) {
  const worker = async () => {
    while (now() < until) {
      const t0 = now();
      const status = await get();
      record(status, now() - t0);
    }
  };
  await Promise.all(Array.from({ length: connections }, worker));
}

async function openLoop(until) {
  const intervalMs = 1000 / ratePerSecond;
  const inFlight = new Set();
  const start = now();
  for (let i = 0; ; i++) {
    const due = start + i * intervalMs;
    if (due >= until) break;
    const wait = due - now();
    if (wait > 1) await new Promise((r) => setTimeout(r, wait));
    const p = get().then((status) => {
      record(status, now() - due);
      inFlight.delete(p);
    });
    inFlight.add(p);
  }
  await Promise.all(inFlight);
}

const run = ratePerSecond ? openLoop : closedLoop;
await run(now() + warmupMs);
counting = true;
const t0 = now();
await run(t0 + durationMs);
const elapsedMs = now() - t0;
latenciesMs.sort((a, b) => a - b);
const pct = (p) => latenciesMs[Math.min(latenciesMs.length - 1, Math.max(0, Math.ceil((p / 100) * latenciesMs.length) - 1))] ?? NaN;
const errors = latenciesMs.length - (statuses[200] ?? 0);
console.log(JSON.stringify({ requests: latenciesMs.length, errors, perSecond: (latenciesMs.length * 1000) / elapsedMs, p50Ms: pct(50), p95Ms: pct(95), p99Ms: pct(99), statuses }));
agent.destroy();
