/**
 * The one Drizzle schema. Times are ISO-8601 UTC text; booleans are SQLite integers.
 * Sessions live in the `sessions` table owned by the session store (kept out of drizzle-kit by
 * `tablesFilter` in drizzle.config.ts).
 */
import { sql } from 'drizzle-orm';
import { index, integer, primaryKey, sqliteTable, text, uniqueIndex } from 'drizzle-orm/sqlite-core';
import { ROLES } from '../constants/schemas/roles';

const createdAt = () =>
  text('created_at')
    .notNull()
    .default(sql`(strftime('%Y-%m-%dT%H:%M:%fZ', 'now'))`);

export const organisations = sqliteTable('organisations', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  name: text('name').notNull(),
  slug: text('slug').notNull().unique(),
  createdAt: createdAt(),
});

export const users = sqliteTable(
  'users',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    /** Stored lower-case; unique across the installation. */
    email: text('email').notNull(),
    name: text('name').notNull(),
    /** scrypt hash (see server/services/passwords.ts); null until an invited user sets one. */
    passwordHash: text('password_hash'),
    active: integer('active', { mode: 'boolean' }).notNull().default(true),
    lastSignInAt: text('last_sign_in_at'),
    createdAt: createdAt(),
    updatedAt: text('updated_at'),
  },
  (t) => [uniqueIndex('users_email_unique').on(t.email)],
);

export const memberships = sqliteTable(
  'memberships',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    userId: integer('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    organisationId: integer('organisation_id')
      .notNull()
      .references(() => organisations.id, { onDelete: 'cascade' }),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex('memberships_user_org_unique').on(t.userId, t.organisationId)],
);

export const membershipRoles = sqliteTable(
  'membership_roles',
  {
    membershipId: integer('membership_id')
      .notNull()
      .references(() => memberships.id, { onDelete: 'cascade' }),
    role: text('role', { enum: ROLES }).notNull(),
  },
  (t) => [primaryKey({ columns: [t.membershipId, t.role] })],
);

/** One-time links: invitations and password resets. Only the SHA-256 of the token is stored. */
export const passwordTokens = sqliteTable(
  'password_tokens',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    userId: integer('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    tokenSha256: text('token_sha256').notNull(),
    purpose: text('purpose', { enum: ['invitation', 'reset'] }).notNull(),
    expiresAt: text('expires_at').notNull(),
    usedAt: text('used_at'),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex('password_tokens_sha_unique').on(t.tokenSha256)],
);

/** Append-only: triggers in the migration refuse UPDATE and DELETE. */
export const auditLog = sqliteTable(
  'audit_log',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    at: createdAt(),
    organisationId: integer('organisation_id').references(() => organisations.id),
    actorUserId: integer('actor_user_id').references(() => users.id),
    action: text('action').notNull(),
    targetType: text('target_type'),
    targetId: text('target_id'),
    /** JSON object with what changed; never passwords or tokens. */
    details: text('details', { mode: 'json' }).$type<Record<string, unknown>>(),
  },
  (t) => [index('audit_log_org_at').on(t.organisationId, t.at)],
);

/** The mail outbox: every message the local SMTP catcher received, or that was relayed. */
export const mailMessages = sqliteTable(
  'mail_messages',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    receivedAt: createdAt(),
    transport: text('transport', { enum: ['catcher', 'smtp'] }).notNull(),
    fromAddress: text('from_address').notNull(),
    toAddress: text('to_address').notNull(),
    subject: text('subject').notNull(),
    text: text('text').notNull(),
    html: text('html'),
  },
  (t) => [index('mail_messages_received').on(t.receivedAt)],
);
