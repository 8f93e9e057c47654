/**
 * `npm start`: build the web app if missing or stale, apply migrations, seed demo data (not in
 * production), start the local mail catcher (unless SMTP_HOST is set), and serve the web app
 * and the API on one port. `--dev` skips the web build (the Expo dev server serves the app).
 */
import './runtime-flags'; // first: V8 flags (see the file)
import fs from 'node:fs';
import type { AddressInfo } from 'node:net';
import { loadConfig } from './env';
import { openDatabase } from '../db/client';
import { applyMigrations } from '../db/migrate';
import { createApp } from './app';
import { createMailer } from './services/mailer';
import { setPasswordHashCost } from './services/passwords';
import { startMailCatcher, type MailCatcher } from './services/mail-catcher';
import { buildWeb, webBuildIsStale } from './web-build';
import { seedDemo } from '../seeds';
import { createStorages } from './storage';
import { sweepOrphans } from './storage/sweep';
import { referenceSources } from './storage/references';
import { DEMO_USERS } from '../seeds/demo-people';

async function main() {
  const dev = process.argv.includes('--dev');
  const config = loadConfig();
  setPasswordHashCost(config.scryptLog2N);
  // The database's folder; each byte storage makes (or finds) its own place on first use.
  fs.mkdirSync(config.dataDir, { recursive: true });

  if (!dev && webBuildIsStale(config.distDir)) buildWeb(config.distDir);

  const handle = openDatabase(config.dbFile);
  applyMigrations(handle.db);

  const storage = createStorages(config);
  const seeded = config.demo.seed ? await seedDemo(handle.db, config.demoPassword, storage.uploads) : undefined;
  // Bytes whose row was never written (a crash between the rename and the insert) and stale
  // temporary files; a minute's grace for another process's upload in flight.
  const swept = await sweepOrphans(storage, handle.db, referenceSources, { minAgeMs: 60_000 });
  const sweptCount = Object.values(swept).reduce((n, r) => n + r.removedObjects.length + r.removedTemporaryFiles, 0);
  if (sweptCount > 0) console.log(`[fieldfile] storage sweep removed ${sweptCount} orphaned file(s)`);

  let catcher: MailCatcher | undefined;
  if (!config.mail.smtp) catcher = await startMailCatcher(handle.db, config.mail.catcherPort);
  const mailer = createMailer(config, () => catcher?.port ?? config.mail.catcherPort);

  const { app, close } = createApp({ handle, config, mailer, serveWeb: !dev, storage });
  const server = app.listen(config.port, config.host, () => {
    const port = (server.address() as AddressInfo).port;
    const url = config.publicUrl.includes(`:${config.port}`) ? config.publicUrl.replace(`:${config.port}`, `:${port}`) : config.publicUrl;
    const lines = [
      '',
      `Fieldfile is running: ${url}`,
      `  data folder: ${config.dataDir}`,
      catcher ? `  mail: local catcher on 127.0.0.1:${catcher.port} (read it in the app: Sent mail)` : `  mail: SMTP ${config.mail.smtp!.host}:${config.mail.smtp!.port}`,
    ];
    if (seeded) {
      lines.push('', `Demo data: on (${config.demo.reason}). Demo sign-ins (password: ${config.demoPassword}):`);
      for (const u of DEMO_USERS) lines.push(`  ${u.email.padEnd(28)} ${u.role}`);
    } else {
      lines.push('', `Demo data: off (${config.demo.reason}). Create the first admin with \`npm run create-admin\`.`);
    }
    console.log(lines.join('\n') + '\n');
  });

  const shutdown = () => {
    server.closeAllConnections();
    server.close(() => {
      close();
      void catcher?.close();
      handle.sqlite.close();
      process.exit(0);
    });
  };
  process.on('SIGINT', shutdown);
  process.on('SIGTERM', shutdown);
}

main().catch((err) => {
  console.error(`[fieldfile] could not start: ${(err as Error).message}`);
  process.exit(1);
});
