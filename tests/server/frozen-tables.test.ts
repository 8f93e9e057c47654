/**
 * Every table whose rows belong to a filing version is frozen once the version is signed, and
 * the rows that make up its content are in the signature hash. This test reads the migrated
 * schema, so a new table with a `version_id` (or one hanging off such a table) fails here until
 * it gets its triggers (DEVELOPERS.md, "Signed versions are frozen") and its place in the hash.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { openDatabase } from '../../db/client';
import { applyMigrations } from '../../db/migrate';
import { seedDemo } from '../../seeds';
import { VERSION_CONTENT_TABLES, VERSION_DERIVED_TABLES, VERSION_REVIEW_TABLES } from '../../server/repos/review-repo';

// Opened while the tests are collected: the table list decides which tests exist.
const t = { handle: openDatabase(':memory:') };
applyMigrations(t.handle.db);
afterAll(() => t.handle.sqlite.close());

const tables = () =>
  (t.handle.sqlite.prepare("select name from sqlite_master where type = 'table' and name not like 'sqlite_%' and name not like '__drizzle%'").all() as { name: string }[]).map((r) => r.name);
const columns = (table: string) => (t.handle.sqlite.prepare(`select name from pragma_table_info(?)`).all(table) as { name: string }[]).map((c) => c.name);
const foreignTables = (table: string) => (t.handle.sqlite.prepare(`select "table" from pragma_foreign_key_list(?)`).all(table) as { table: string }[]).map((f) => f.table);
const triggers = (table: string) => t.handle.sqlite.prepare("select name, sql from sqlite_master where type = 'trigger' and tbl_name = ?").all(table) as { name: string; sql: string }[];

/**
 * Tables whose rows belong to a version: a version_id column, or a foreign key to such a table or
 * to the version's device (each version has its own device row, frozen with it).
 */
function versionTables(): string[] {
  const all = tables();
  const derived: readonly string[] = VERSION_DERIVED_TABLES;
  const direct = all.filter((n) => n !== 'version_signatures' && !derived.includes(n) && columns(n).includes('version_id'));
  const owners = [...direct.filter((f) => f !== 'filing_versions'), 'devices'];
  const indirect = all.filter((n) => !direct.includes(n) && n !== 'filing_versions' && n !== 'filings' && foreignTables(n).some((f) => owners.includes(f)));
  return [...direct, ...indirect];
}

describe('signed versions are frozen in every table that belongs to a version', () => {
  it('finds the wizard, screening and review tables', () => {
    expect(versionTables()).toEqual(
      expect.arrayContaining(['antennas', 'transmitters', 'use_positions', 'use_position_separations', 'market_selections', 'screening_results', 'review_comments', 'device_modules']),
    );
  });

  it.each(versionTables())('%s refuses INSERT, UPDATE and DELETE on a signed version', (table) => {
    const t2 = triggers(table).filter((x) => /signed version is frozen/.test(x.sql));
    for (const op of ['INSERT', 'UPDATE', 'DELETE']) {
      expect(
        t2.some((x) => x.sql.includes(`BEFORE ${op}`)),
        `${table}: no frozen-version trigger BEFORE ${op}`,
      ).toBe(true);
    }
  });

  it.each(versionTables())('%s is in the signature hash or named as review metadata', (table) => {
    const hashed = VERSION_CONTENT_TABLES.map((x) => x.table);
    expect(hashed.includes(table) || (VERSION_REVIEW_TABLES as readonly string[]).includes(table), `${table}: add it to VERSION_CONTENT_TABLES in server/repos/review-repo.ts`).toBe(true);
  });

  it('the version itself, its device and its signature cannot change once signed', () => {
    for (const table of ['filing_versions', 'devices', 'version_signatures']) {
      const sqls = triggers(table)
        .map((x) => x.sql)
        .join('\n');
      expect(sqls).toMatch(/BEFORE UPDATE/);
      expect(sqls).toMatch(/BEFORE DELETE/);
    }
  });
});

/**
 * The triggers at work, not only their text: a signed version with rows in the wizard's, the
 * lab's and the review's tables (the demo tracker, whose lab data is seeded), each of its rows
 * touched with raw SQL, as someone with the database file would.
 */
describe('raw SQL against a signed version’s rows is refused, table by table', () => {
  const s = { handle: openDatabase(':memory:'), versionId: 0 };
  beforeAll(async () => {
    applyMigrations(s.handle.db);
    await seedDemo(s.handle.db, 'frozen-tables-password-1');
    s.versionId = (s.handle.sqlite.prepare('select min(id) as id from filing_versions').get() as { id: number }).id;
    s.handle.sqlite.prepare("update filing_versions set state = 'signed' where id = ?").run(s.versionId);
  });
  afterAll(() => s.handle.sqlite.close());

  /** The rows of the signed version in a table: by its own version_id, or through the version table its foreign key names. */
  function scope(table: string): string | null {
    if (columns(table).includes('version_id')) return `version_id = ${s.versionId}`;
    const fk = (t.handle.sqlite.prepare('select "table", "from" from pragma_foreign_key_list(?)').all(table) as { table: string; from: string }[]).find((f) => columns(f.table).includes('version_id'));
    return fk ? `"${fk.from}" in (select id from "${fk.table}" where version_id = ${s.versionId})` : null;
  }
  const withRows = () =>
    versionTables().filter((table) => {
      const where = scope(table);
      return where !== null && (s.handle.sqlite.prepare(`select count(*) as n from "${table}" where ${where}`).get() as { n: number }).n > 0;
    });
  const count = (table: string) => (s.handle.sqlite.prepare(`select count(*) as n from "${table}" where ${scope(table)}`).get() as { n: number }).n;

  it('the signed version has rows in the wizard’s and the lab’s tables', () => {
    expect(withRows()).toEqual(expect.arrayContaining(['antennas', 'transmitters', 'use_positions', 'use_position_separations', 'lab_measurements', 'lab_liquid_checks', 'lab_instruments']));
  });

  it('UPDATE (even to the same value) and DELETE are refused in every one of them, and no row changes', () => {
    const tables = withRows();
    for (const table of tables) {
      const column = columns(table).find((c) => c !== 'id' && c !== 'version_id')!;
      const before = count(table);
      expect(() => s.handle.sqlite.prepare(`update "${table}" set "${column}" = "${column}" where ${scope(table)}`).run(), `${table}: UPDATE`).toThrow(/signed version is frozen/);
      expect(() => s.handle.sqlite.prepare(`delete from "${table}" where ${scope(table)}`).run(), `${table}: DELETE`).toThrow(/signed version is frozen/);
      expect(count(table), table).toBe(before);
    }
  });
});
