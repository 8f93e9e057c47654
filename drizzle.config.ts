import { defineConfig } from 'drizzle-kit';

export default defineConfig({
  dialect: 'sqlite',
  schema: './db/schema.ts',
  out: './db/migrations',
  // The session store owns `sessions`; drizzle-kit must neither create nor drop it.
  tablesFilter: ['!sessions'],
  dbCredentials: { url: process.env.FIELDFILE_DB_FILE ?? './data/fieldfile.db' },
});
