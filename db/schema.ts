/**
 * The one Drizzle schema. Times are ISO-8601 UTC text; booleans are SQLite integers.
 * Sessions live in the `sessions` table owned by the session store (kept out of drizzle-kit by
 * `tablesFilter` in drizzle.config.ts).
 */
import { sql } from 'drizzle-orm';
import { index, integer, primaryKey, real, sqliteTable, text, uniqueIndex, type AnySQLiteColumn } from 'drizzle-orm/sqlite-core';
import { EVIDENCE_CATEGORY_IDS } from '../constants/schemas/evidence';
import { ROLES } from '../constants/schemas/roles';
import { DATA_STEPS, VERSION_STATES } from '../constants/schemas/filings';
import { AVERAGING_MASSES, DISTRIBUTIONS, INSTRUMENT_KINDS, LIQUID_KINDS } from '../constants/schemas/lab';
import { ANTENNA_USES, POWER_MODE_TRIGGERS } from '../calc/screening/input';
import { FCC_SAR_SCREENINGS, INTEGRATIONS, PRODUCT_TYPES, REGIMES, TIERS, USE_POSITION_KINDS } from '../constants/schemas/device-file';

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
    // Grant identity ('' = not stated): FCC ID = grantee code + product code (47 CFR §2.926),
    // ISED certification number = company number + UPN, and RSP-100's HVIN, PMN and FVIN.
    fccGranteeCode: text('fcc_grantee_code').notNull().default(''),
    fccProductCode: text('fcc_product_code').notNull().default(''),
    isedCompanyNumber: text('ised_company_number').notNull().default(''),
    isedUpn: text('ised_upn').notNull().default(''),
    hvin: text('hvin').notNull().default(''),
    pmn: text('pmn').notNull().default(''),
    fvin: text('fvin').notNull().default(''),
    /** Other model numbers the filing covers: [{ model, difference }]. */
    modelVariants: text('model_variants', { mode: 'json' }).notNull().default([]).$type<{ model: string; difference: string }[]>(),
    integration: text('integration', { enum: INTEGRATIONS }).notNull().default('host'),
  },
  (t) => [index('devices_org').on(t.organisationId)],
);

/**
 * Certified modules inside a host device, with their grant and its conditions. They belong to
 * the device row, which each version has its own copy of, and are frozen with it.
 */
export const deviceModules = sqliteTable(
  'device_modules',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    deviceId: integer('device_id')
      .notNull()
      .references(() => devices.id, { onDelete: 'cascade' }),
    /** The user's label ("LTE-MOD"), unique within the device. */
    key: text('key').notNull(),
    name: text('name').notNull().default(''),
    fccGranteeCode: text('fcc_grantee_code').notNull().default(''),
    fccProductCode: text('fcc_product_code').notNull().default(''),
    isedCompanyNumber: text('ised_company_number').notNull().default(''),
    isedUpn: text('ised_upn').notNull().default(''),
    /** The grant's minimum separation from the body, m; null when the grant states none. */
    minSeparationM: real('min_separation_m'),
    conditions: text('conditions').notNull().default(''),
    sortOrder: integer('sort_order').notNull(),
  },
  (t) => [uniqueIndex('device_modules_device_key').on(t.deviceId, t.key)],
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
    /** Set while the filing is archived: hidden from the default list and read-only until restored. */
    archivedAt: text('archived_at'),
    archivedByUserId: integer('archived_by_user_id').references(() => users.id),
    /** SHA-256 of the device description file it was imported from (null when created from nothing): a second import of the same file warns. */
    importSha256: text('import_sha256'),
  },
  (t) => [index('filings_org_updated').on(t.organisationId, t.updatedAt), index('filings_org_import').on(t.organisationId, t.importSha256)],
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
    /**
     * The device identity this version was filed with. Version N+1 gets its own copy, so a
     * signed version's device never changes. Null only on rows made before versions had it.
     */
    deviceId: integer('device_id').references(() => devices.id),
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
    /** Tune-up target and ± tolerance (null when only the maximum is stated); target + tolerance = max. */
    tuneUpTargetDbm: real('tune_up_target_dbm'),
    tuneUpToleranceDb: real('tune_up_tolerance_db'),
    mode: text('mode').notNull().default(''),
    modulation: text('modulation').notNull().default(''),
    bandwidth: text('bandwidth').notNull().default(''),
    /** The duty-factor preset (constants/duty-factors.ts) the duty cycle came from; '' when typed. */
    dutyCyclePreset: text('duty_cycle_preset').notNull().default(''),
    /** The certified module (of the version's device) this transmitter belongs to. */
    moduleId: integer('module_id').references(() => deviceModules.id, { onDelete: 'set null' }),
    /** With further antennas (transmitter_antennas): all at once (MIMO) or one at a time. */
    antennaUse: text('antenna_use', { enum: ANTENNA_USES }).notNull().default('mimo'),
  },
  (t) => [uniqueIndex('transmitters_version_key').on(t.versionId, t.key)],
);

/**
 * A transmitter's antennas after its first (transmitters.antenna_id), in order: MIMO or switched.
 * By row, so renaming an antenna changes nothing here; removing one takes it out.
 */
export const transmitterAntennas = sqliteTable(
  'transmitter_antennas',
  {
    transmitterId: integer('transmitter_id')
      .notNull()
      .references(() => transmitters.id, { onDelete: 'cascade' }),
    antennaId: integer('antenna_id')
      .notNull()
      .references(() => antennas.id, { onDelete: 'cascade' }),
    sortOrder: integer('sort_order').notNull(),
  },
  (t) => [primaryKey({ columns: [t.transmitterId, t.antennaId] })],
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

/**
 * A transmitter's reduced tune-up power in one use position, with what triggers it (hotspot
 * back-off, proximity sensor, time-averaged SAR limit). By row on both sides, so renaming the
 * position or the transmitter changes nothing here; removing either takes the row with it.
 */
export const usePositionPowerModes = sqliteTable(
  'use_position_power_modes',
  {
    usePositionId: integer('use_position_id')
      .notNull()
      .references(() => usePositions.id, { onDelete: 'cascade' }),
    transmitterId: integer('transmitter_id')
      .notNull()
      .references(() => transmitters.id, { onDelete: 'cascade' }),
    reducedTuneUpPowerDbm: real('reduced_tune_up_power_dbm').notNull(),
    trigger: text('trigger', { enum: POWER_MODE_TRIGGERS }).notNull(),
    sortOrder: integer('sort_order').notNull(),
  },
  (t) => [primaryKey({ columns: [t.usePositionId, t.transmitterId] })],
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

/**
 * Transmitter combinations that can be on together; members are in simultaneous_group_members.
 * A combination holds in one use position, or in every one when `use_position_id` is null (the
 * device file's list). Removing the position removes its combinations.
 */
export const simultaneousGroups = sqliteTable('simultaneous_groups', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  versionId: versionRef(),
  sortOrder: integer('sort_order').notNull(),
  usePositionId: integer('use_position_id').references(() => usePositions.id, { onDelete: 'cascade' }),
});

/** A combination's transmitters, by row: renaming a transmitter changes nothing here. */
export const simultaneousGroupMembers = sqliteTable(
  'simultaneous_group_members',
  {
    groupId: integer('group_id')
      .notNull()
      .references(() => simultaneousGroups.id, { onDelete: 'cascade' }),
    transmitterId: integer('transmitter_id')
      .notNull()
      .references(() => transmitters.id, { onDelete: 'cascade' }),
    sortOrder: integer('sort_order').notNull(),
  },
  (t) => [primaryKey({ columns: [t.groupId, t.transmitterId] })],
);

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
export const labResults = sqliteTable('lab_results', computedResultColumns(), (t) => [uniqueIndex('lab_results_version_input').on(t.versionId, t.inputSha256, t.engineVersion, t.ruleSetVersion)]);

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

// ---------------------------------------------------------------------------------------------
// Evidence: files filed in a category, owned by a filing version. The bytes live in the byte
// storage under their SHA-256; a new version carries rows forward by reference (same hash).

export const evidenceFiles = sqliteTable(
  'evidence_files',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    versionId: versionRef(),
    category: text('category', { enum: EVIDENCE_CATEGORY_IDS }).notNull(),
    title: text('title').notNull(),
    note: text('note').notNull().default(''),
    /** The uploader's file name, cleaned; a display name only, never a path. */
    fileName: text('file_name').notNull(),
    sizeBytes: integer('size_bytes').notNull(),
    /** Sniffed from the bytes, not taken from the client. */
    mediaType: text('media_type').notNull(),
    sha256: text('sha256').notNull(),
    /** A calibration, check or signature date the uploader gave (YYYY-MM-DD). */
    documentDate: text('document_date'),
    uploadedByUserId: integer('uploaded_by_user_id')
      .notNull()
      .references(() => users.id),
    uploadedAt: createdAt(),
    /** The record this one replaced (kept as history). */
    replacesId: integer('replaces_id').references((): AnySQLiteColumn => evidenceFiles.id, { onDelete: 'set null' }),
    /** The record that replaced this one; null while current. */
    replacedById: integer('replaced_by_id').references((): AnySQLiteColumn => evidenceFiles.id, { onDelete: 'set null' }),
    /** The record of an earlier version this one was carried forward from. */
    carriedFromId: integer('carried_from_id').references((): AnySQLiteColumn => evidenceFiles.id, { onDelete: 'set null' }),
  },
  (t) => [index('evidence_files_version').on(t.versionId), index('evidence_files_sha256').on(t.sha256)],
);

/** Text read back from a stored PDF, per content hash (the same bytes are read once). */
export const documentTexts = sqliteTable('document_texts', {
  sha256: text('sha256').primaryKey(),
  status: text('status', { enum: ['read', 'unreadable'] }).notNull(),
  /** Why it could not be read (encrypted, damaged). */
  reason: text('reason'),
  pageCount: integer('page_count').notNull().default(0),
  /** JSON array: one string per page, lines separated by \n. */
  pages: text('pages', { mode: 'json' }).notNull().$type<string[]>(),
  readAt: createdAt(),
});

/** An engineer's reason why a read-back difference is acceptable. */
export const evidenceExplanations = sqliteTable(
  'evidence_explanations',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    versionId: versionRef(),
    evidenceId: integer('evidence_id')
      .notNull()
      .references(() => evidenceFiles.id, { onDelete: 'cascade' }),
    findingKey: text('finding_key').notNull(),
    reason: text('reason').notNull(),
    userId: integer('user_id')
      .notNull()
      .references(() => users.id),
    at: createdAt(),
  },
  (t) => [uniqueIndex('evidence_explanations_key').on(t.evidenceId, t.findingKey)],
);

// ---------------------------------------------------------------------------------------------
// Review and signing. A signed version is frozen by the triggers of migration
// "signed_versions_frozen": every row that belongs to it refuses UPDATE, DELETE and INSERT.

/** Who changed a version's data (separation of duties: they may not sign it). Insert-only. */
export const versionEditors = sqliteTable(
  'version_editors',
  {
    versionId: versionRef(),
    userId: integer('user_id')
      .notNull()
      .references(() => users.id),
    firstEditAt: createdAt(),
  },
  (t) => [primaryKey({ columns: [t.versionId, t.userId] })],
);

export const REVIEW_THREAD_STATES = ['open', 'resolved'] as const;

/** A comment thread on a step (and optionally one row of it, by the row's user-facing id). */
export const reviewThreads = sqliteTable(
  'review_threads',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    versionId: versionRef(),
    step: text('step').notNull(),
    rowRef: text('row_ref'),
    state: text('state', { enum: REVIEW_THREAD_STATES }).notNull().default('open'),
    createdByUserId: integer('created_by_user_id')
      .notNull()
      .references(() => users.id),
    createdAt: createdAt(),
    resolvedByUserId: integer('resolved_by_user_id').references(() => users.id),
    resolvedAt: text('resolved_at'),
  },
  (t) => [index('review_threads_version').on(t.versionId)],
);

export const reviewComments = sqliteTable(
  'review_comments',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    threadId: integer('thread_id')
      .notNull()
      .references(() => reviewThreads.id, { onDelete: 'cascade' }),
    authorUserId: integer('author_user_id')
      .notNull()
      .references(() => users.id),
    body: text('body').notNull(),
    createdAt: createdAt(),
  },
  (t) => [index('review_comments_thread').on(t.threadId)],
);

/** One signature per version (the unique index makes two approvers at once end in one). Never changes. */
export const versionSignatures = sqliteTable(
  'version_signatures',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    versionId: integer('version_id')
      .notNull()
      .references(() => filingVersions.id),
    signerUserId: integer('signer_user_id')
      .notNull()
      .references(() => users.id),
    signerName: text('signer_name').notNull(),
    signerRole: text('signer_role').notNull(),
    signedAt: text('signed_at').notNull(),
    statement: text('statement').notNull(),
    /** Name of the canonical serialisation the hash was computed over (bump when it changes). */
    contentFormat: text('content_format').notNull(),
    contentSha256: text('content_sha256').notNull(),
    /** The readiness checklist as it stood at signing (JSON text). */
    checklist: text('checklist').notNull(),
  },
  (t) => [uniqueIndex('version_signatures_version').on(t.versionId)],
);

// ---------------------------------------------------------------------------------------------
// Background jobs and submission packages.

/**
 * Background jobs (package builds) run by the in-process queue (server/jobs/queue.ts). A job
 * that was queued or running when the server stopped is marked failed at the next start and can
 * be run again.
 */
export const jobs = sqliteTable(
  'jobs',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    kind: text('kind').notNull(),
    organisationId: integer('organisation_id')
      .notNull()
      .references(() => organisations.id),
    /** JSON: what the job works on. */
    payload: text('payload', { mode: 'json' }).notNull().$type<Record<string, unknown>>(),
    state: text('state', { enum: ['queued', 'running', 'done', 'failed'] })
      .notNull()
      .default('queued'),
    stage: text('stage').notNull().default('queued'),
    percent: integer('percent').notNull().default(0),
    /** JSON: what a finished job produced. */
    result: text('result', { mode: 'json' }).$type<Record<string, unknown>>(),
    error: text('error'),
    requestedByUserId: integer('requested_by_user_id').references(() => users.id),
    createdAt: createdAt(),
    startedAt: text('started_at'),
    finishedAt: text('finished_at'),
  },
  (t) => [index('jobs_org_created').on(t.organisationId, t.createdAt), index('jobs_state').on(t.state)],
);

/**
 * Built submission packages. A signed version has one package; a draft keeps its latest
 * preview (marked DRAFT on every page). The zip itself is kept by the byte storage.
 */
export const packages = sqliteTable(
  'packages',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    versionId: versionRef(),
    kind: text('kind', { enum: ['signed', 'preview'] }).notNull(),
    fileName: text('file_name').notNull(),
    storageKey: text('storage_key').notNull(),
    sizeBytes: integer('size_bytes').notNull(),
    sha256: text('sha256').notNull(),
    /** SHA-256 of manifest.json inside the zip, so a zip's manifest can be recognised. */
    manifestSha256: text('manifest_sha256').notNull(),
    /** SHA-256 of the exhibit model the package was built from (a preview is rebuilt when it changes). */
    modelSha256: text('model_sha256').notNull(),
    jobId: integer('job_id').references(() => jobs.id),
    builtAt: createdAt(),
  },
  (t) => [uniqueIndex('packages_version_kind').on(t.versionId, t.kind), index('packages_sha256').on(t.sha256), index('packages_manifest_sha256').on(t.manifestSha256)],
);
