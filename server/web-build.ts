/**
 * Builds the web app (expo export) when dist/ is missing or older than its sources, so that
 * `npm start` on a fresh clone or after a pull always serves the current app.
 */
import fs from 'node:fs';
import path from 'node:path';
import { spawnSync } from 'node:child_process';

const ROOT = path.resolve(__dirname, '..');
const SOURCES = ['app', 'components', 'hooks', 'constants', 'assets', 'app.json', 'metro.config.js', 'package-lock.json'];
const STAMP = '.fieldfile-build';

function newestMtimeMs(p: string): number {
  if (!fs.existsSync(p)) return 0;
  const stat = fs.statSync(p);
  if (!stat.isDirectory()) return stat.mtimeMs;
  let newest = stat.mtimeMs;
  for (const entry of fs.readdirSync(p)) newest = Math.max(newest, newestMtimeMs(path.join(p, entry)));
  return newest;
}

export function webBuildIsStale(distDir: string): boolean {
  const stamp = path.join(distDir, STAMP);
  if (!fs.existsSync(path.join(distDir, 'index.html')) || !fs.existsSync(stamp)) return true;
  const built = fs.statSync(stamp).mtimeMs;
  return SOURCES.some((s) => newestMtimeMs(path.join(ROOT, s)) > built);
}

export function buildWeb(distDir: string): void {
  const started = Date.now();
  console.log('[fieldfile] building the web app (expo export)…');
  const result = spawnSync(path.join(ROOT, 'node_modules', '.bin', 'expo'), ['export', '--platform', 'web', '--output-dir', distDir], {
    cwd: ROOT,
    stdio: 'inherit',
    env: { ...process.env, CI: '1', EXPO_NO_TELEMETRY: '1', EXPO_OFFLINE: '1' },
  });
  if (result.status !== 0) throw new Error(`expo export failed (exit ${result.status}); see the output above.`);
  // The fonts' licences travel with the fonts (SIL OFL 1.1 asks for it).
  const licences = path.join(distDir, 'licences');
  fs.mkdirSync(licences, { recursive: true });
  for (const f of fs.readdirSync(path.join(ROOT, 'assets', 'fonts')).filter((n) => n.endsWith('.txt'))) {
    fs.copyFileSync(path.join(ROOT, 'assets', 'fonts', f), path.join(licences, f));
  }
  fs.writeFileSync(path.join(distDir, STAMP), new Date().toISOString());
  console.log(`[fieldfile] web app built in ${((Date.now() - started) / 1000).toFixed(1)} s`);
}
