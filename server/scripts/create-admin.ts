/**
 * `npm run create-admin`: makes the first admin of a production install (where no demo data is
 * seeded). Asks for what is missing, then prints a one-time link to set the password, so no
 * password ever passes through the command line or shell history.
 *   npm run create-admin -- --email ada@example.com --name "Ada Nwosu" --organisation "Example Radio Ltd"
 */
import fs from 'node:fs';
import { createInterface } from 'node:readline/promises';
import { parseArgs } from 'node:util';
import { z } from 'zod';
import { loadConfig } from '../env';
import { openDatabase } from '../../db/client';
import { applyMigrations } from '../../db/migrate';
import { findOrganisationBySlug, insertOrganisation } from '../repos/users-repo';
import { zCreateUser } from '../../constants/schemas/users';
import { issueInvitationLink } from '../services/users-service';

const slugify = (s: string) =>
  s
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-|-$/g, '')
    .slice(0, 60) || 'organisation';

async function main() {
  const { values } = parseArgs({ options: { email: { type: 'string' }, name: { type: 'string' }, organisation: { type: 'string' } } });
  const rl = createInterface({ input: process.stdin, output: process.stdout });
  const ask = async (label: string, given?: string) => given ?? (await rl.question(`${label}: `)).trim();
  const organisationName = await ask('Organisation name', values.organisation);
  const email = await ask('Admin e-mail', values.email);
  const name = await ask('Admin name', values.name);
  rl.close();

  const orgParsed = z.string().trim().min(1, 'Enter an organisation name.').max(120).safeParse(organisationName);
  const userParsed = zCreateUser.safeParse({ email, name, roles: ['admin'] });
  if (!orgParsed.success || !userParsed.success) {
    const issues = [...(orgParsed.error?.issues ?? []), ...(userParsed.error?.issues ?? [])].map((i) => `  ${i.path.join('.') || 'organisation'}: ${i.message}`);
    console.error(`Nothing was created:\n${issues.join('\n')}`);
    process.exit(2);
  }

  const config = loadConfig();
  fs.mkdirSync(config.dataDir, { recursive: true });
  const handle = openDatabase(config.dbFile);
  applyMigrations(handle.db);
  const slug = slugify(orgParsed.data);
  const org = findOrganisationBySlug(handle.db, slug) ?? insertOrganisation(handle.db, { name: orgParsed.data, slug });
  try {
    const link = issueInvitationLink(handle.db, config.publicUrl, org.id, userParsed.data);
    console.log(`\nAdmin ${userParsed.data.email} added to ${org.name}.\nSet the password within 7 days here:\n  ${link}\n`);
  } catch (err) {
    console.error(`Nothing was created: ${(err as Error).message}`);
    process.exitCode = 2;
  } finally {
    handle.sqlite.close();
  }
}

void main();
