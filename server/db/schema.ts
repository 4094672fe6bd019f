/**
 * Kilowatch's database schema (Drizzle, PostgreSQL). Migrations in drizzle/ are generated from this file with
 * `npm run db:generate` and committed; never edit a shipped migration by hand.
 *
 * Every company-owned row carries company_id (directly or through its vessel) so that services can scope every
 * query to the signed-in user's company.
 */
import { sql } from 'drizzle-orm';
import {
  bigserial,
  boolean,
  date,
  doublePrecision,
  index,
  integer,
  jsonb,
  pgEnum,
  pgTable,
  primaryKey,
  text,
  timestamp,
  uniqueIndex,
  uuid,
} from 'drizzle-orm/pg-core';

export const roleEnum = pgEnum('role', ['admin', 'superintendent', 'chief_engineer', 'energy_officer', 'planner']);
export const speedClassEnum = pgEnum('speed_class', ['high', 'medium', 'low']);
export const dutyEnum = pgEnum('genset_duty', ['service', 'emergency']);

const createdAt = () => timestamp('created_at', { withTimezone: true }).notNull().defaultNow();
const updatedAt = () => timestamp('updated_at', { withTimezone: true }).notNull().defaultNow();

export const companies = pgTable('companies', {
  id: uuid('id').primaryKey().defaultRandom(),
  name: text('name').notNull(),
  /** ISO 4217 code the company reports fuel cost in. */
  currency: text('currency').notNull().default('USD'),
  createdAt: createdAt(),
  updatedAt: updatedAt(),
});

export const users = pgTable(
  'users',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    email: text('email').notNull(),
    name: text('name').notNull(),
    /** argon2id hash; null until an invited user sets a password. */
    passwordHash: text('password_hash'),
    disabledAt: timestamp('disabled_at', { withTimezone: true }),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [uniqueIndex('users_email_lower_idx').on(sql`lower(${t.email})`)],
);

export const memberships = pgTable(
  'memberships',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    userId: uuid('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    companyId: uuid('company_id')
      .notNull()
      .references(() => companies.id, { onDelete: 'cascade' }),
    role: roleEnum('role').notNull(),
    /** When true the member sees only the vessels listed in membership_vessels. */
    vesselScoped: boolean('vessel_scoped').notNull().default(false),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex('memberships_user_company_idx').on(t.userId, t.companyId)],
);

export const vessels = pgTable(
  'vessels',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    companyId: uuid('company_id')
      .notNull()
      .references(() => companies.id, { onDelete: 'cascade' }),
    name: text('name').notNull(),
    /** Seven-digit ship number (invented in the demo). */
    imoNumber: text('imo_number').notNull(),
    vesselType: text('vessel_type').notNull(),
    /** Fuel grades carried, e.g. ['VLSFO', 'MGO']. */
    fuelGrades: text('fuel_grades').array().notNull().default(sql`'{}'::text[]`),
    /** Load-dependent start/stop thresholds the vessel's power management system uses (the savings baseline). */
    pmsStartAbovePct: doublePrecision('pms_start_above_pct').notNull().default(85),
    pmsStopBelowPct: doublePrecision('pms_stop_below_pct').notNull().default(40),
    /** From this date the chief engineer follows Kilowatch's recommendations (for the before/after comparison). */
    followsRecommendationsFrom: date('follows_recommendations_from'),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [uniqueIndex('vessels_company_imo_idx').on(t.companyId, t.imoNumber), index('vessels_company_idx').on(t.companyId)],
);

export const membershipVessels = pgTable(
  'membership_vessels',
  {
    membershipId: uuid('membership_id')
      .notNull()
      .references(() => memberships.id, { onDelete: 'cascade' }),
    vesselId: uuid('vessel_id')
      .notNull()
      .references(() => vessels.id, { onDelete: 'cascade' }),
  },
  (t) => [primaryKey({ columns: [t.membershipId, t.vesselId] })],
);

export const invitations = pgTable('invitations', {
  id: uuid('id').primaryKey().defaultRandom(),
  companyId: uuid('company_id')
    .notNull()
    .references(() => companies.id, { onDelete: 'cascade' }),
  email: text('email').notNull(),
  role: roleEnum('role').notNull(),
  vesselIds: uuid('vessel_ids').array().notNull().default(sql`'{}'::uuid[]`),
  /** SHA-256 of the one-time token; the token itself is only in the e-mail. */
  tokenHash: text('token_hash').notNull().unique(),
  invitedBy: uuid('invited_by').references(() => users.id, { onDelete: 'set null' }),
  expiresAt: timestamp('expires_at', { withTimezone: true }).notNull(),
  acceptedAt: timestamp('accepted_at', { withTimezone: true }),
  revokedAt: timestamp('revoked_at', { withTimezone: true }),
  createdAt: createdAt(),
});

export const passwordResets = pgTable('password_resets', {
  id: uuid('id').primaryKey().defaultRandom(),
  userId: uuid('user_id')
    .notNull()
    .references(() => users.id, { onDelete: 'cascade' }),
  tokenHash: text('token_hash').notNull().unique(),
  expiresAt: timestamp('expires_at', { withTimezone: true }).notNull(),
  usedAt: timestamp('used_at', { withTimezone: true }),
  createdAt: createdAt(),
});

/** Server-side record of each signed session token (its jti), so sign-out and password resets revoke it. */
export const sessions = pgTable('sessions', {
  id: uuid('id').primaryKey().defaultRandom(),
  userId: uuid('user_id')
    .notNull()
    .references(() => users.id, { onDelete: 'cascade' }),
  companyId: uuid('company_id')
    .notNull()
    .references(() => companies.id, { onDelete: 'cascade' }),
  expiresAt: timestamp('expires_at', { withTimezone: true }).notNull(),
  revokedAt: timestamp('revoked_at', { withTimezone: true }),
  createdAt: createdAt(),
});

export const busSections = pgTable(
  'bus_sections',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    vesselId: uuid('vessel_id')
      .notNull()
      .references(() => vessels.id, { onDelete: 'cascade' }),
    name: text('name').notNull(),
    sortOrder: integer('sort_order').notNull().default(0),
  },
  (t) => [uniqueIndex('bus_sections_vessel_name_idx').on(t.vesselId, t.name)],
);

/** Maker's shop-test SFOC (g/kWh) at 25/50/75/85/100 % load; null where the maker gives none. */
export interface ShopTestSfoc {
  p25: number | null;
  p50: number | null;
  p75: number | null;
  p85: number | null;
  p100: number | null;
}

export const gensets = pgTable(
  'gensets',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    vesselId: uuid('vessel_id')
      .notNull()
      .references(() => vessels.id, { onDelete: 'cascade' }),
    busSectionId: uuid('bus_section_id').references(() => busSections.id, { onDelete: 'restrict' }),
    designation: text('designation').notNull(),
    ratedKw: doublePrecision('rated_kw').notNull(),
    ratedKva: doublePrecision('rated_kva').notNull(),
    voltageV: doublePrecision('voltage_v').notNull(),
    frequencyHz: doublePrecision('frequency_hz').notNull(),
    speedClass: speedClassEnum('speed_class').notNull(),
    minLoadPct: doublePrecision('min_load_pct').notNull(),
    maxLoadPct: doublePrecision('max_load_pct').notNull(),
    startCostKg: doublePrecision('start_cost_kg').notNull().default(0),
    minUpH: doublePrecision('min_up_h').notNull().default(0),
    minDownH: doublePrecision('min_down_h').notNull().default(0),
    shopTestSfoc: jsonb('shop_test_sfoc').$type<ShopTestSfoc>().notNull(),
    duty: dutyEnum('duty').notNull().default('service'),
    /** false: out of service (maintenance, defect); never recommended. */
    available: boolean('available').notNull().default(true),
    unavailableReason: text('unavailable_reason'),
    /** true: the chief engineer wants it online whatever the load. */
    mustRun: boolean('must_run').notNull().default(false),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [uniqueIndex('gensets_vessel_designation_idx').on(t.vesselId, t.designation)],
);

/** One maintenance kind of a set (e.g. top overhaul), its interval and when it was last done. */
export const gensetMaintenance = pgTable(
  'genset_maintenance',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    gensetId: uuid('genset_id')
      .notNull()
      .references(() => gensets.id, { onDelete: 'cascade' }),
    kind: text('kind').notNull(),
    intervalHours: doublePrecision('interval_hours').notNull(),
    intervalMonths: integer('interval_months'),
    lastDoneRunningHours: doublePrecision('last_done_running_hours'),
    lastDoneOn: date('last_done_on'),
  },
  (t) => [uniqueIndex('genset_maintenance_kind_idx').on(t.gensetId, t.kind)],
);

/** A bunker delivery: the lot a day's fuel came from. */
export const fuelLots = pgTable('fuel_lots', {
  id: uuid('id').primaryKey().defaultRandom(),
  vesselId: uuid('vessel_id')
    .notNull()
    .references(() => vessels.id, { onDelete: 'cascade' }),
  reference: text('reference').notNull(),
  grade: text('grade').notNull(),
  density15KgPerM3: doublePrecision('density15_kg_per_m3').notNull(),
  lcvMjPerKg: doublePrecision('lcv_mj_per_kg').notNull(),
  lcvEstimated: boolean('lcv_estimated').notNull().default(false),
  sulphurPct: doublePrecision('sulphur_pct'),
  quantityT: doublePrecision('quantity_t'),
  deliveredOn: date('delivered_on').notNull(),
  /** Delivery note or lab report, stored under the upload folder by a generated name. */
  attachmentPath: text('attachment_path'),
  attachmentName: text('attachment_name'),
  attachmentType: text('attachment_type'),
  attachmentBytes: integer('attachment_bytes'),
  createdAt: createdAt(),
});

/**
 * One genset's raw engine-room log for one day, as entered or imported. Derived values (hours run, kWh, SFOC,
 * corrected fuel) are computed by optimizer/ from these raw values, never stored in place of them.
 */
export const gensetDailyLogs = pgTable(
  'genset_daily_logs',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    gensetId: uuid('genset_id')
      .notNull()
      .references(() => gensets.id, { onDelete: 'cascade' }),
    logDate: date('log_date').notNull(),
    runningHoursMeter: doublePrecision('running_hours_meter'),
    hoursRun: doublePrecision('hours_run'),
    kwhMeter: doublePrecision('kwh_meter'),
    kwh: doublePrecision('kwh'),
    fuelMassKg: doublePrecision('fuel_mass_kg'),
    fuelVolumeL: doublePrecision('fuel_volume_l'),
    fuelTempC: doublePrecision('fuel_temp_c'),
    fuelLotId: uuid('fuel_lot_id').references(() => fuelLots.id, { onDelete: 'set null' }),
    remarks: text('remarks'),
    excludedFromFit: boolean('excluded_from_fit').notNull().default(false),
    excludeReason: text('exclude_reason'),
    /** 'manual' or 'import'; importId names the import that last wrote the row. */
    source: text('source').notNull().default('manual'),
    importId: uuid('import_id'),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [uniqueIndex('genset_daily_logs_day_idx').on(t.gensetId, t.logDate), index('genset_daily_logs_import_idx').on(t.importId)],
);

/** A recorded meter replacement or rollover: the old meter's last reading and the new meter's first. */
export const meterReplacements = pgTable(
  'meter_replacements',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    gensetId: uuid('genset_id')
      .notNull()
      .references(() => gensets.id, { onDelete: 'cascade' }),
    meter: text('meter').$type<'running_hours' | 'kwh'>().notNull(),
    replacedOn: date('replaced_on').notNull(),
    oldFinalReading: doublePrecision('old_final_reading').notNull(),
    newStartReading: doublePrecision('new_start_reading').notNull(),
    remarks: text('remarks'),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex('meter_replacements_day_idx').on(t.gensetId, t.meter, t.replacedOn)],
);

/** One CSV import: who, when, which file, what it did; undo restores exactly what it changed. */
export const logImports = pgTable('log_imports', {
  id: uuid('id').primaryKey().defaultRandom(),
  vesselId: uuid('vessel_id')
    .notNull()
    .references(() => vessels.id, { onDelete: 'cascade' }),
  userId: uuid('user_id').references(() => users.id, { onDelete: 'set null' }),
  fileName: text('file_name').notNull(),
  fileSha256: text('file_sha256').notNull(),
  rowsNew: integer('rows_new').notNull().default(0),
  rowsChanged: integer('rows_changed').notNull().default(0),
  rowsUnchanged: integer('rows_unchanged').notNull().default(0),
  rowsRejected: integer('rows_rejected').notNull().default(0),
  status: text('status').$type<'committed' | 'undone'>().notNull().default('committed'),
  undoneAt: timestamp('undone_at', { withTimezone: true }),
  undoneBy: uuid('undone_by').references(() => users.id, { onDelete: 'set null' }),
  createdAt: createdAt(),
});

/** What an import wrote to one log row: its values before (null when the import created the row). */
export const logImportChanges = pgTable(
  'log_import_changes',
  {
    id: bigserial('id', { mode: 'number' }).primaryKey(),
    importId: uuid('import_id')
      .notNull()
      .references(() => logImports.id, { onDelete: 'cascade' }),
    gensetId: uuid('genset_id')
      .notNull()
      .references(() => gensets.id, { onDelete: 'cascade' }),
    logDate: date('log_date').notNull(),
    before: jsonb('before'),
  },
  (t) => [index('log_import_changes_import_idx').on(t.importId)],
);

/** A saved CSV column mapping of a vessel, offered on its next upload. */
export const columnMappings = pgTable(
  'column_mappings',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    vesselId: uuid('vessel_id')
      .notNull()
      .references(() => vessels.id, { onDelete: 'cascade' }),
    name: text('name').notNull(),
    /** { columns: { [header]: { field, unit } }, dateFormat, decimalSeparator, delimiter } */
    mapping: jsonb('mapping').notNull(),
    updatedAt: updatedAt(),
  },
  (t) => [uniqueIndex('column_mappings_vessel_name_idx').on(t.vesselId, t.name)],
);

/** Hours a vessel spent in each operating mode on a day (they add up to 24 h on a complete day). */
export const vesselModeHours = pgTable(
  'vessel_mode_hours',
  {
    vesselId: uuid('vessel_id')
      .notNull()
      .references(() => vessels.id, { onDelete: 'cascade' }),
    logDate: date('log_date').notNull(),
    seaH: doublePrecision('sea_h').notNull().default(0),
    manoeuvringH: doublePrecision('manoeuvring_h').notNull().default(0),
    portH: doublePrecision('port_h').notNull().default(0),
    anchorageH: doublePrecision('anchorage_h').notNull().default(0),
    shorePowerH: doublePrecision('shore_power_h').notNull().default(0),
  },
  (t) => [primaryKey({ columns: [t.vesselId, t.logDate] })],
);

/** Every change to company data: who, when, what, before and after. */
export const auditLog = pgTable(
  'audit_log',
  {
    id: bigserial('id', { mode: 'number' }).primaryKey(),
    companyId: uuid('company_id').references(() => companies.id, { onDelete: 'cascade' }),
    userId: uuid('user_id').references(() => users.id, { onDelete: 'set null' }),
    at: timestamp('at', { withTimezone: true }).notNull().defaultNow(),
    entity: text('entity').notNull(),
    entityId: text('entity_id').notNull(),
    action: text('action').notNull(),
    before: jsonb('before'),
    after: jsonb('after'),
  },
  (t) => [index('audit_log_company_at_idx').on(t.companyId, t.at)],
);

/** Every e-mail the app sent (or failed to send), for the admin outbox. */
export const mailOutbox = pgTable(
  'mail_outbox',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    companyId: uuid('company_id').references(() => companies.id, { onDelete: 'cascade' }),
    toAddress: text('to_address').notNull(),
    subject: text('subject').notNull(),
    bodyText: text('body_text').notNull(),
    status: text('status').notNull(),
    error: text('error'),
    smtpMessageId: text('smtp_message_id'),
    createdAt: createdAt(),
  },
  (t) => [index('mail_outbox_company_idx').on(t.companyId, t.createdAt)],
);

/** Sign-in attempts per key (e-mail and client address) for rate limiting across server processes. */
export const signInAttempts = pgTable(
  'sign_in_attempts',
  {
    id: bigserial('id', { mode: 'number' }).primaryKey(),
    key: text('key').notNull(),
    at: timestamp('at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('sign_in_attempts_key_at_idx').on(t.key, t.at)],
);

// ---------------------------------------------------------------------------------------------------------------
// Curves

/** A stored fuel-curve fit with the exact inputs it used, so a report can be reproduced. */
export const curveFits = pgTable(
  'curve_fits',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    gensetId: uuid('genset_id')
      .notNull()
      .references(() => gensets.id, { onDelete: 'cascade' }),
    /** 'since_overhaul' | 'rolling_90' | 'rolling_180' | 'rolling_365' | 'custom' */
    windowKind: text('window_kind').notNull(),
    fromDate: date('from_date'),
    toDate: date('to_date'),
    /** Hash of the inputs; a fit is refreshed when the logs behind it change. */
    inputHash: text('input_hash').notNull(),
    inputs: jsonb('inputs').notNull(),
    result: jsonb('result').notNull(),
    createdAt: createdAt(),
  },
  (t) => [index('curve_fits_genset_idx').on(t.gensetId, t.windowKind, t.createdAt)],
);

// ---------------------------------------------------------------------------------------------------------------
// Recommendations

/** A vessel's spinning-reserve rule for one operating mode. */
export const operatingRules = pgTable(
  'operating_rules',
  {
    vesselId: uuid('vessel_id')
      .notNull()
      .references(() => vessels.id, { onDelete: 'cascade' }),
    mode: text('mode').$type<'sea' | 'manoeuvring' | 'port' | 'anchorage'>().notNull(),
    marginKw: doublePrecision('margin_kw').notNull().default(0),
    marginPct: doublePrecision('margin_pct').notNull().default(0),
    minSets: integer('min_sets').notNull().default(1),
    nMinus1: boolean('n_minus_1').notNull().default(false),
    busTieClosed: boolean('bus_tie_closed').notNull().default(true),
    updatedAt: updatedAt(),
  },
  (t) => [primaryKey({ columns: [t.vesselId, t.mode] })],
);

/** A dated, versioned operating guideline (load bands per combination) for the engine control room. */
export const guidelines = pgTable(
  'guidelines',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    vesselId: uuid('vessel_id')
      .notNull()
      .references(() => vessels.id, { onDelete: 'cascade' }),
    version: integer('version').notNull(),
    inputHash: text('input_hash').notNull(),
    inputs: jsonb('inputs').notNull(),
    result: jsonb('result').notNull(),
    createdBy: uuid('created_by').references(() => users.id, { onDelete: 'set null' }),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex('guidelines_vessel_version_idx').on(t.vesselId, t.version)],
);

/** A voyage plan: its stored inputs (so it can be solved again), its result, and its approval. */
export const voyagePlans = pgTable(
  'voyage_plans',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    vesselId: uuid('vessel_id')
      .notNull()
      .references(() => vessels.id, { onDelete: 'cascade' }),
    name: text('name').notNull(),
    status: text('status').$type<'queued' | 'solving' | 'solved' | 'failed' | 'approved'>().notNull().default('queued'),
    progress: doublePrecision('progress').notNull().default(0),
    inputs: jsonb('inputs').notNull(),
    result: jsonb('result'),
    error: text('error'),
    createdBy: uuid('created_by').references(() => users.id, { onDelete: 'set null' }),
    approvedBy: uuid('approved_by').references(() => users.id, { onDelete: 'set null' }),
    approvedAt: timestamp('approved_at', { withTimezone: true }),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [index('voyage_plans_vessel_idx').on(t.vesselId, t.createdAt)],
);

// ---------------------------------------------------------------------------------------------------------------
// Savings, reports, e-mail subscriptions

/** The company's fuel price per grade from a date (set by an admin). */
export const fuelPrices = pgTable(
  'fuel_prices',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    companyId: uuid('company_id')
      .notNull()
      .references(() => companies.id, { onDelete: 'cascade' }),
    grade: text('grade').notNull(),
    pricePerT: doublePrecision('price_per_t').notNull(),
    validFrom: date('valid_from').notNull(),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex('fuel_prices_grade_from_idx').on(t.companyId, t.grade, t.validFrom)],
);

/** A user's subscription to a report or alert by e-mail. */
export const subscriptions = pgTable(
  'subscriptions',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    companyId: uuid('company_id')
      .notNull()
      .references(() => companies.id, { onDelete: 'cascade' }),
    userId: uuid('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    kind: text('kind').$type<'vessel_monthly_report' | 'fleet_monthly_report' | 'drift_alert' | 'overhaul_alert'>().notNull(),
    /** null: the whole fleet the user may see. */
    vesselId: uuid('vessel_id').references(() => vessels.id, { onDelete: 'cascade' }),
    /** For overhaul alerts: warn this many running hours before a due date. */
    hoursBefore: doublePrecision('hours_before'),
    createdAt: createdAt(),
  },
  (t) => [index('subscriptions_company_idx').on(t.companyId, t.kind)],
);

/** One delivery of a subscription for one period or alert key: the unique key makes every send happen once. */
export const deliveries = pgTable(
  'deliveries',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    subscriptionId: uuid('subscription_id')
      .notNull()
      .references(() => subscriptions.id, { onDelete: 'cascade' }),
    /** e.g. '2026-11' for a monthly report, 'genset:<id>:top overhaul:<due hours>' for an alert. */
    deliveryKey: text('delivery_key').notNull(),
    sentAt: timestamp('sent_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex('deliveries_once_idx').on(t.subscriptionId, t.deliveryKey)],
);

// ---------------------------------------------------------------------------------------------------------------
// Running hours and overhaul planning

/** Maintenance work done: it resets its interval and starts a new post-overhaul curve window. */
export const maintenanceEvents = pgTable(
  'maintenance_events',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    gensetId: uuid('genset_id')
      .notNull()
      .references(() => gensets.id, { onDelete: 'cascade' }),
    kind: text('kind').notNull(),
    doneOn: date('done_on').notNull(),
    runningHours: doublePrecision('running_hours').notNull(),
    remarks: text('remarks'),
    recordedBy: uuid('recorded_by').references(() => users.id, { onDelete: 'set null' }),
    createdAt: createdAt(),
  },
  (t) => [index('maintenance_events_genset_idx').on(t.gensetId, t.doneOn)],
);

/** A planned port call or dry-dock window in which maintenance work can be done. */
export const workWindows = pgTable(
  'work_windows',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    vesselId: uuid('vessel_id')
      .notNull()
      .references(() => vessels.id, { onDelete: 'cascade' }),
    kind: text('kind').$type<'port_call' | 'dry_dock'>().notNull(),
    place: text('place').notNull(),
    startsOn: date('starts_on').notNull(),
    endsOn: date('ends_on').notNull(),
    createdAt: createdAt(),
  },
  (t) => [index('work_windows_vessel_idx').on(t.vesselId, t.startsOn)],
);

/** Hour budgets per set until a date, proposed to stagger due dates; approved ones feed voyage plans. */
export const hourBudgetPlans = pgTable(
  'hour_budget_plans',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    vesselId: uuid('vessel_id')
      .notNull()
      .references(() => vessels.id, { onDelete: 'cascade' }),
    untilDate: date('until_date').notNull(),
    inputs: jsonb('inputs').notNull(),
    result: jsonb('result').notNull(),
    status: text('status').$type<'proposed' | 'approved' | 'superseded'>().notNull().default('proposed'),
    createdBy: uuid('created_by').references(() => users.id, { onDelete: 'set null' }),
    approvedBy: uuid('approved_by').references(() => users.id, { onDelete: 'set null' }),
    approvedAt: timestamp('approved_at', { withTimezone: true }),
    createdAt: createdAt(),
  },
  (t) => [index('hour_budget_plans_vessel_idx').on(t.vesselId, t.createdAt)],
);
