// Keeps two heavy calculations in flight against FIELDFILE_BENCH_BASE until killed, so the
// load comes from another process, as it would from another user. Prints a count on SIGTERM.
const base = process.env.FIELDFILE_BENCH_BASE;
const cookie = process.env.FIELDFILE_BENCH_COOKIE;
const body = process.env.FIELDFILE_BENCH_BODY;
let finished = 0;
process.on('SIGTERM', () => {
  process.stdout.write(`${finished}\n`, () => process.exit(0));
});
async function loop() {
  for (;;) {
    try {
      const res = await fetch(`${base}/calc/screening`, { method: 'POST', headers: { 'content-type': 'application/json', cookie }, body });
      await res.arrayBuffer();
      finished += 1;
    } catch {
      await new Promise((r) => setTimeout(r, 100));
    }
  }
}
void loop();
void loop();
