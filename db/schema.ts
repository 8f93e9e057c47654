/**
 * The one Drizzle schema. Times are ISO-8601 UTC text; booleans are SQLite integers.
 * Sessions live in the `sessions` table owned by the session store (kept out of drizzle-kit by
 * `tablesFilter` in drizzle.config.ts).
 */
import { sql } from 'drizzle-orm';
import { index, integer, primaryKey, real, sqliteTable, text, uniqueIndex } from 'drizzle-orm/sqlite-core';
import { ROLES } from '../constants/schemas/roles';
import { DATA_STEPS, VERSION_STATES } from '../constants/schemas/filings';
import { AVERAGING_MASSES, DISTRIBUTIONS, INSTRUMENT_KINDS, LIQUID_KINDS } from '../constants/schemas/lab';
import { FCC_SAR_SCREENINGS, PRODUCT_TYPES, REGIMES, TIERS, USE_POSITION_KINDS } from '../constants/schemas/device-file';

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
    /** The person's name as this organisation knows it; each organisation keeps its own. */
    name: text('name').notNull().default(''),
    /** Deactivation is per organisation: another organisation's membership is untouched. */
    active: integer('active', { mode: 'boolean' }).notNull().default(true),
    /** Null until the invitee sets their password or accepts the invitation. */
    acceptedAt: text('accepted_at'),
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
    /** For an invitation: the organisation whose membership the link accepts. */
    organisationId: integer('organisation_id').references(() => organisations.id, { onDelete: 'cascade' }),
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

/**
 * The mail outbox: every message the local SMTP catcher received. Each row belongs to the
 * organisation that sent it (null: mail about an account, e.g. a password reset, shown to no
 * organisation). With real SMTP nothing is kept.
 */
export const mailMessages = sqliteTable(
  'mail_messages',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    organisationId: integer('organisation_id').references(() => organisations.id, { onDelete: 'cascade' }),
    receivedAt: createdAt(),
    transport: text('transport', { enum: ['catcher', 'smtp'] }).notNull(),
    fromAddress: text('from_address').notNull(),
    toAddress: text('to_address').notNull(),
    subject: text('subject').notNull(),
    text: text('text').notNull(),
    html: text('html'),
  },
  (t) => [index('mail_messages_received').on(t.receivedAt), index('mail_messages_org').on(t.organisationId, t.id)],
);

// ---------------------------------------------------------------------------------------------
// Filings: one device, one filing, numbered versions. The wizard's data belongs to a version so
// that a signed version stays frozen while the next one is edited.


export const devices = sqliteTable(
  'devices',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    organisationId: integer('organisation_id')
      .notNull()
      .references(() => organisations.id),
    name: text('name').notNull(),
    model: text('model').notNull(),
    applicant: text('applicant').notNull(),
    productType: text('product_type', { enum: PRODUCT_TYPES }).notNull(),
    hardwareVersion: text('hardware_version').notNull().default(''),
    firmwareVersion: text('firmware_version').notNull().default(''),
    createdAt: createdAt(),
    updatedAt: text('updated_at'),
  },
  (t) => [index('devices_org').on(t.organisationId)],
);

export const filings = sqliteTable(
  'filings',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    organisationId: integer('organisation_id')
      .notNull()
      .references(() => organisations.id),
    deviceId: integer('device_id')
      .notNull()
      .references(() => devices.id),
    ownerUserId: integer('owner_user_id')
      .notNull()
      .references(() => users.id),
    createdAt: createdAt(),
    updatedAt: text('updated_at')
      .notNull()
      .default(sql`(strftime('%Y-%m-%dT%H:%M:%fZ', 'now'))`),
  },
  (t) => [index('filings_org_updated').on(t.organisationId, t.updatedAt)],
);

export const filingVersions = sqliteTable(
  'filing_versions',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    filingId: integer('filing_id')
      .notNull()
      .references(() => filings.id, { onDelete: 'cascade' }),
    number: integer('number').notNull(),
    state: text('state', { enum: VERSION_STATES }).notNull().default('draft'),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex('filing_versions_filing_number').on(t.filingId, t.number)],
);

const versionRef = () =>
  integer('version_id')
    .notNull()
    .references(() => filingVersions.id, { onDelete: 'cascade' });

export const antennas = sqliteTable(
  'antennas',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    versionId: versionRef(),
    /** The user's own id for the antenna ("ANT1"), unique within a version. */
    key: text('key').notNull(),
    gainDbi: real('gain_dbi').notNull(),
    location: text('location').notNull().default(''),
    sortOrder: integer('sort_order').notNull(),
  },
  (t) => [uniqueIndex('antennas_version_key').on(t.versionId, t.key)],
);

export const transmitters = sqliteTable(
  'transmitters',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    versionId: versionRef(),
    key: text('key').notNull(),
    technology: text('technology').notNull(),
    band: text('band').notNull(),
    frequencyMinHz: real('frequency_min_hz').notNull(),
    frequencyMaxHz: real('frequency_max_hz').notNull(),
    maxTuneUpPowerDbm: real('max_tune_up_power_dbm').notNull(),
    dutyCycle: real('duty_cycle').notNull(),
    antennaId: integer('antenna_id')
      .notNull()
      .references(() => antennas.id),
    sortOrder: integer('sort_order').notNull(),
  },
  (t) => [uniqueIndex('transmitters_version_key').on(t.versionId, t.key)],
);

export const usePositions = sqliteTable(
  'use_positions',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    versionId: versionRef(),
    key: text('key').notNull(),
    kind: text('kind', { enum: USE_POSITION_KINDS }).notNull(),
    sortOrder: integer('sort_order').notNull(),
  },
  (t) => [uniqueIndex('use_positions_version_key').on(t.versionId, t.key)],
);

export const usePositionSeparations = sqliteTable(
  'use_position_separations',
  {
    usePositionId: integer('use_position_id')
      .notNull()
      .references(() => usePositions.id, { onDelete: 'cascade' }),
    antennaId: integer('antenna_id')
      .notNull()
      .references(() => antennas.id, { onDelete: 'cascade' }),
    separationM: real('separation_m').notNull(),
  },
  (t) => [primaryKey({ columns: [t.usePositionId, t.antennaId] })],
);

export const marketSelections = sqliteTable(
  'market_selections',
  {
    versionId: versionRef(),
    regime: text('regime', { enum: REGIMES }).notNull(),
    tier: text('tier', { enum: TIERS }).notNull(),
    fccSarScreening: text('fcc_sar_screening', { enum: FCC_SAR_SCREENINGS }),
    sortOrder: integer('sort_order').notNull(),
  },
  (t) => [primaryKey({ columns: [t.versionId, t.regime] })],
);

/** Transmitter combinations that can be on together (stored by transmitter key). */
export const simultaneousGroups = sqliteTable('simultaneous_groups', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  versionId: versionRef(),
  transmitterKeys: text('transmitter_keys', { mode: 'json' }).notNull().$type<string[]>(),
  sortOrder: integer('sort_order').notNull(),
});

/**
 * What the user typed in a step that does not validate yet, so a reload loses nothing. Cleared
 * when the step saves cleanly.
 */
export const stepDrafts = sqliteTable(
  'step_drafts',
  {
    versionId: versionRef(),
    step: text('step', { enum: DATA_STEPS }).notNull(),
    data: text('data', { mode: 'json' }).notNull().$type<unknown>(),
    updatedAt: text('updated_at').notNull(),
  },
  (t) => [primaryKey({ columns: [t.versionId, t.step] })],
);

/** Columns of a stored engine result: the input's hash and text, the output, and the versions used. */
const computedResultColumns = () => ({
  id: integer('id').primaryKey({ autoIncrement: true }),
  versionId: versionRef(),
  computedAt: createdAt(),
  engineVersion: text('engine_version').notNull(),
  ruleSetVersion: text('rule_set_version').notNull(),
  /** SHA-256 of the engine input, so an unchanged filing is not stored twice. */
  inputSha256: text('input_sha256').notNull(),
  /** JSON text, kept as text so a stored result is sent without parsing it again. */
  input: text('input').notNull(),
  output: text('output').notNull(),
});

/** Each distinct screening computed for a version, with the engine and rule-set versions used. */
export const screeningResults = sqliteTable('screening_results', computedResultColumns(), (t) => [
  uniqueIndex('screening_results_version_input').on(t.versionId, t.inputSha256, t.engineVersion, t.ruleSetVersion),
]);

// ---------------------------------------------------------------------------------------------
// Lab results (the test engineer's data), owned by a filing version like the radios. Transmitters
// and use positions are referenced by the user's keys, because a Radios save replaces their rows.

export const labMeasurements = sqliteTable(
  'lab_measurements',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    versionId: versionRef(),
    key: text('key').notNull(),
    transmitterKey: text('transmitter_key').notNull(),
    usePositionKey: text('use_position_key').notNull(),
    testPosition: text('test_position').notNull().default(''),
    channel: text('channel').notNull().default(''),
    frequencyHz: real('frequency_hz').notNull(),
    testSeparationM: real('test_separation_m').notNull(),
    measuredPowerDbm: real('measured_power_dbm').notNull(),
    /** Null: the transmitter's maximum tune-up power applies. */
    tuneUpPowerDbm: real('tune_up_power_dbm'),
    testDutyCycle: real('test_duty_cycle').notNull().default(1),
    sar1gWPerKg: real('sar_1g_w_per_kg'),
    sar10gWPerKg: real('sar_10g_w_per_kg'),
    repeatSarWPerKg: text('repeat_sar_w_per_kg', { mode: 'json' }).notNull().$type<number[]>(),
    driftDb: real('drift_db'),
    testDate: text('test_date').notNull(),
    peakXMm: real('peak_x_mm'),
    peakYMm: real('peak_y_mm'),
    liquidCheckKey: text('liquid_check_key'),
    systemCheckKey: text('system_check_key'),
    sortOrder: integer('sort_order').notNull(),
  },
  (t) => [uniqueIndex('lab_measurements_version_key').on(t.versionId, t.key)],
);

export const labLiquidChecks = sqliteTable(
  'lab_liquid_checks',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    versionId: versionRef(),
    key: text('key').notNull(),
    date: text('date').notNull(),
    liquid: text('liquid', { enum: LIQUID_KINDS }).notNull(),
    frequencyHz: real('frequency_hz').notNull(),
    relativePermittivity: real('relative_permittivity').notNull(),
    conductivitySPerM: real('conductivity_s_per_m').notNull(),
    temperatureC: real('temperature_c'),
    sortOrder: integer('sort_order').notNull(),
  },
  (t) => [uniqueIndex('lab_liquid_checks_version_key').on(t.versionId, t.key)],
);

export const labSystemChecks = sqliteTable(
  'lab_system_checks',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    versionId: versionRef(),
    key: text('key').notNull(),
    date: text('date').notNull(),
    frequencyHz: real('frequency_hz').notNull(),
    dipoleSerial: text('dipole_serial').notNull().default(''),
    averagingMass: text('averaging_mass', { enum: AVERAGING_MASSES }).notNull(),
    measuredSarWPerKgPerW: real('measured_sar_w_per_kg_per_w').notNull(),
    targetSarWPerKgPerW: real('target_sar_w_per_kg_per_w').notNull(),
    sortOrder: integer('sort_order').notNull(),
  },
  (t) => [uniqueIndex('lab_system_checks_version_key').on(t.versionId, t.key)],
);

export const labInstruments = sqliteTable(
  'lab_instruments',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    versionId: versionRef(),
    key: text('key').notNull(),
    kind: text('kind', { enum: INSTRUMENT_KINDS }).notNull(),
    model: text('model').notNull().default(''),
    serial: text('serial').notNull().default(''),
    calibrationDate: text('calibration_date').notNull(),
    dueDate: text('due_date').notNull(),
    sortOrder: integer('sort_order').notNull(),
  },
  (t) => [uniqueIndex('lab_instruments_version_key').on(t.versionId, t.key)],
);

export const labUncertaintyComponents = sqliteTable(
  'lab_uncertainty_components',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    versionId: versionRef(),
    name: text('name').notNull(),
    valuePct: real('value_pct').notNull(),
    distribution: text('distribution', { enum: DISTRIBUTIONS }).notNull(),
    divisor: real('divisor'),
    sensitivity: real('sensitivity').notNull(),
    degreesOfFreedom: real('degrees_of_freedom'),
    sortOrder: integer('sort_order').notNull(),
  },
  (t) => [uniqueIndex('lab_uncertainty_components_version_name').on(t.versionId, t.name)],
);

/** Each distinct lab-results computation for a version, with the engine and rule-set versions. */
export const labResults = sqliteTable('lab_results', computedResultColumns(), (t) => [
  uniqueIndex('lab_results_version_input').on(t.versionId, t.inputSha256, t.engineVersion, t.ruleSetVersion),
]);

/** The column mapping an organisation last used for a spreadsheet with a given header row. */
export const labImportMappings = sqliteTable(
  'lab_import_mappings',
  {
    organisationId: integer('organisation_id')
      .notNull()
      .references(() => organisations.id, { onDelete: 'cascade' }),
    /** SHA-256 of the header row (trimmed, lower-case, joined by a tab). */
    headerSha256: text('header_sha256').notNull(),
    mapping: text('mapping', { mode: 'json' }).notNull().$type<Record<string, { column: string; unit?: string }>>(),
    updatedAt: text('updated_at').notNull(),
  },
  (t) => [primaryKey({ columns: [t.organisationId, t.headerSha256] })],
);
