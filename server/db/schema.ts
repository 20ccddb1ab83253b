import { sql } from 'drizzle-orm';
import {
  bigint,
  boolean,
  customType,
  double,
  index,
  int,
  json,
  mysqlEnum,
  mysqlTable,
  primaryKey,
  text,
  timestamp,
  varchar,
} from 'drizzle-orm/mysql-core';
import type { ChannelSetup } from '../../shared/schemas/channelSetup';
import type { PowerQuality } from '../../shared/schemas/powerQuality';
import type { SystemSpec } from '../../shared/schemas/threePhase';
import type { FrontEndProfile } from '../../shared/schemas/meterSimulation';
import type { ComplianceRequest } from '../../shared/schemas/compliance';

/** Binary sample data: Buffer in, Buffer out. */
const longblob = customType<{ data: Buffer; driverData: Buffer }>({
  dataType: () => 'longblob',
});

/**
 * An auto-increment primary key. Not drizzle's serial(): it emits `serial AUTO_INCREMENT`, which
 * MariaDB rejects as a syntax error.
 */
const id = () => bigint('id', { mode: 'number', unsigned: true }).autoincrement().primaryKey();

/** A foreign key to an id: unsigned bigint, never serial (which would mean AUTO_INCREMENT). */
const ref = (name: string) => bigint(name, { mode: 'number', unsigned: true });

export const projectVisibility = ['team', 'members'] as const;
export const memberRoles = ['engineer', 'viewer'] as const;

export const users = mysqlTable('users', {
  id: id(),
  email: varchar('email', { length: 254 }).notNull().unique(),
  name: varchar('name', { length: 120 }).notNull(),
  passwordHash: varchar('password_hash', { length: 100 }).notNull(),
  role: mysqlEnum('role', ['admin', 'engineer', 'viewer']).notNull(),
  active: boolean('active').notNull().default(true),
  createdAt: timestamp('created_at').notNull().defaultNow(),
});

export const projects = mysqlTable('projects', {
  id: id(),
  name: varchar('name', { length: 160 }).notNull(),
  description: text('description').notNull(),
  archived: boolean('archived').notNull().default(false),
  /** 'team': every signed-in user sees it (by their role). 'members': only its members, its creator and admins. */
  visibility: mysqlEnum('visibility', projectVisibility).notNull().default('team'),
  /** The declared supply voltage (V) for the project's captures, unless a capture has its own. */
  declaredVoltage: double('declared_voltage'),
  createdBy: ref('created_by').references(() => users.id),
  /** Set on the project that receives a user's uploads when none is named. */
  defaultFor: ref('default_for').unique().references(() => users.id),
  createdAt: timestamp('created_at').notNull().defaultNow(),
});

/**
 * Who may see a members-only project, and with what role in it. The role never lifts anyone above
 * their own role: a viewer stays a viewer whatever the project says.
 */
export const projectMembers = mysqlTable(
  'project_members',
  {
    projectId: ref('project_id').notNull().references(() => projects.id, { onDelete: 'cascade' }),
    userId: ref('user_id').notNull().references(() => users.id, { onDelete: 'cascade' }),
    role: mysqlEnum('role', memberRoles).notNull(),
    addedBy: ref('added_by').references(() => users.id),
    addedAt: timestamp('added_at').notNull().defaultNow(),
  },
  (t) => [primaryKey({ columns: [t.projectId, t.userId] }), index('project_members_user').on(t.userId)],
);

export const captureStatus = ['queued', 'processing', 'ready', 'failed'] as const;

export const captures = mysqlTable(
  'captures',
  {
    id: id(),
    projectId: ref('project_id').notNull().references(() => projects.id),
    name: varchar('name', { length: 200 }).notNull(),
    status: mysqlEnum('status', captureStatus).notNull().default('queued'),
    errorCode: varchar('error_code', { length: 40 }),
    errorMessage: text('error_message'),
    errorLine: int('error_line'),
    uploadedBy: ref('uploaded_by').references(() => users.id),
    originalName: varchar('original_name', { length: 255 }).notNull(),
    sha256: varchar('sha256', { length: 64 }).notNull(),
    sizeBytes: bigint('size_bytes', { mode: 'number' }).notNull(),
    /** The original file, gzip-compressed, relative to DATA_DIR. */
    originalPath: varchar('original_path', { length: 255 }),
    /** Sample rate entered by the user for files that carry no time base. */
    sampleRateHint: double('sample_rate_hint'),
    sampleRate: double('sample_rate'),
    sampleCount: bigint('sample_count', { mode: 'number' }),
    t0: double('t0'),
    detected: json('detected'),
    metadata: json('metadata'),
    tags: json('tags').$type<string[]>().notNull().default(sql`('[]')`),
    engineVersion: int('engine_version'),
    /** How each channel is turned into engineering units; applied to the file's values at every (re-)analysis. */
    channelSetup: json('channel_setup').$type<ChannelSetup[]>().notNull().default(sql`('[]')`),
    /** Three-phase sets as a user stated them; null: found automatically. */
    systems: json('systems').$type<SystemSpec[] | null>(),
    /** The declared supply voltage (V) for dips and swells; null: the project's, else a suggestion. */
    declaredVoltage: double('declared_voltage'),
    /** Three-phase systems and voltage events of the last analysis. */
    powerQuality: json('power_quality').$type<PowerQuality>(),
    createdAt: timestamp('created_at').notNull().defaultNow(),
    readyAt: timestamp('ready_at'),
  },
  (t) => [index('captures_project').on(t.projectId), index('captures_sha').on(t.sha256)],
);

export const channels = mysqlTable(
  'channels',
  {
    captureId: ref('capture_id').notNull().references(() => captures.id, { onDelete: 'cascade' }),
    idx: int('idx').notNull(),
    name: varchar('name', { length: 120 }).notNull(),
    unit: varchar('unit', { length: 20 }).notNull(),
    invalidCount: int('invalid_count').notNull().default(0),
    analysis: json('analysis'),
  },
  (t) => [primaryKey({ columns: [t.captureId, t.idx] })],
);

/** Samples as little-endian Float32, in chunks of up to 2^20 per channel. */
export const sampleChunks = mysqlTable(
  'sample_chunks',
  {
    captureId: ref('capture_id').notNull().references(() => captures.id, { onDelete: 'cascade' }),
    channelIdx: int('channel_idx').notNull(),
    chunkIdx: int('chunk_idx').notNull(),
    startIndex: bigint('start_index', { mode: 'number' }).notNull(),
    count: int('count').notNull(),
    data: longblob('data').notNull(),
  },
  (t) => [primaryKey({ columns: [t.captureId, t.channelIdx, t.chunkIdx] })],
);

/** Min/max pyramid: level L holds (min, max) Float32 pairs over buckets of bucketSize samples. */
export const overviews = mysqlTable(
  'overviews',
  {
    captureId: ref('capture_id').notNull().references(() => captures.id, { onDelete: 'cascade' }),
    channelIdx: int('channel_idx').notNull(),
    bucketSize: int('bucket_size').notNull(),
    data: longblob('data').notNull(),
  },
  (t) => [primaryKey({ columns: [t.captureId, t.channelIdx, t.bucketSize] })],
);

export const jobs = mysqlTable(
  'jobs',
  {
    id: id(),
    kind: mysqlEnum('kind', ['ingest', 'reanalyse']).notNull(),
    captureId: ref('capture_id').notNull().references(() => captures.id, { onDelete: 'cascade' }),
    status: mysqlEnum('status', ['queued', 'running', 'done', 'failed']).notNull().default('queued'),
    attempts: int('attempts').notNull().default(0),
    lastError: text('last_error'),
    lockedBy: varchar('locked_by', { length: 80 }),
    heartbeatAt: timestamp('heartbeat_at'),
    createdAt: timestamp('created_at').notNull().defaultNow(),
    finishedAt: timestamp('finished_at'),
  },
  (t) => [index('jobs_status').on(t.status, t.id)],
);

export const annotations = mysqlTable(
  'annotations',
  {
    id: id(),
    captureId: ref('capture_id').notNull().references(() => captures.id, { onDelete: 'cascade' }),
    channelIdx: int('channel_idx'),
    startS: double('start_s').notNull(),
    endS: double('end_s').notNull(),
    label: varchar('label', { length: 160 }).notNull(),
    note: text('note').notNull(),
    severity: mysqlEnum('severity', ['info', 'warning', 'fault']).notNull().default('info'),
    /** 'finder' marks a suggestion of the anomaly finder, 'user' an engineer's own mark. */
    source: mysqlEnum('source', ['user', 'finder']).notNull().default('user'),
    state: mysqlEnum('state', ['active', 'suggested', 'dismissed']).notNull().default('active'),
    reason: text('reason'),
    createdBy: ref('created_by').references(() => users.id),
    createdAt: timestamp('created_at').notNull().defaultNow(),
    updatedAt: timestamp('updated_at').notNull().defaultNow().onUpdateNow(),
  },
  (t) => [index('annotations_capture').on(t.captureId)],
);

export const comments = mysqlTable(
  'comments',
  {
    id: id(),
    captureId: ref('capture_id').notNull().references(() => captures.id, { onDelete: 'cascade' }),
    body: text('body').notNull(),
    createdBy: ref('created_by').references(() => users.id),
    createdAt: timestamp('created_at').notNull().defaultNow(),
  },
  (t) => [index('comments_capture').on(t.captureId)],
);

export const comparisons = mysqlTable('comparisons', {
  id: id(),
  name: varchar('name', { length: 160 }).notNull(),
  captureIds: json('capture_ids').$type<number[]>().notNull(),
  settings: json('settings').notNull(),
  createdBy: ref('created_by').references(() => users.id),
  createdAt: timestamp('created_at').notNull().defaultNow(),
});

/**
 * Harmonic limit checks an engineer kept with a capture, so that its report lists them. Only the request
 * is kept: the result is computed again from the capture's current analysis, so it never goes stale.
 */
export const limitChecks = mysqlTable(
  'limit_checks',
  {
    id: id(),
    captureId: ref('capture_id').notNull().references(() => captures.id, { onDelete: 'cascade' }),
    request: json('request').$type<ComplianceRequest>().notNull(),
    createdBy: ref('created_by').references(() => users.id),
    createdAt: timestamp('created_at').notNull().defaultNow(),
  },
  (t) => [index('limit_checks_capture').on(t.captureId)],
);

/** A read-only link to a capture or a saved comparison. Only the token's SHA-256 is stored. */
export const shares = mysqlTable(
  'shares',
  {
    id: id(),
    tokenHash: varchar('token_hash', { length: 64 }).notNull().unique(),
    captureId: ref('capture_id').references(() => captures.id, { onDelete: 'cascade' }),
    comparisonId: ref('comparison_id').references(() => comparisons.id, { onDelete: 'cascade' }),
    createdBy: ref('created_by').references(() => users.id),
    email: varchar('email', { length: 254 }),
    createdAt: timestamp('created_at').notNull().defaultNow(),
    expiresAt: timestamp('expires_at').notNull(),
    revokedAt: timestamp('revoked_at'),
    lastOpenedAt: timestamp('last_opened_at'),
    openCount: int('open_count').notNull().default(0),
  },
  (t) => [index('shares_capture').on(t.captureId), index('shares_comparison').on(t.comparisonId)],
);

/** One-time links: an invitation to set a first password, or a password reset. */
export const oneTimeTokens = mysqlTable('one_time_tokens', {
  id: id(),
  tokenHash: varchar('token_hash', { length: 64 }).notNull().unique(),
  purpose: mysqlEnum('purpose', ['invite', 'reset']).notNull(),
  userId: ref('user_id').notNull().references(() => users.id, { onDelete: 'cascade' }),
  createdAt: timestamp('created_at').notNull().defaultNow(),
  expiresAt: timestamp('expires_at').notNull(),
  usedAt: timestamp('used_at'),
});

/** Messages caught by the local SMTP sink (when no SMTP_URL is set). */
export const mailMessages = mysqlTable('mail_messages', {
  id: id(),
  recipients: varchar('recipients', { length: 1000 }).notNull(),
  subject: varchar('subject', { length: 500 }).notNull(),
  text: text('text').notNull(),
  html: text('html').notNull(),
  raw: text('raw').notNull(),
  receivedAt: timestamp('received_at').notNull().defaultNow(),
});

/**
 * A signed-in browser. The session cookie carries a random id (the JWT's jti) of which only the SHA-256
 * is kept, so a session can be ended on the server before its token expires.
 */
export const sessions = mysqlTable(
  'sessions',
  {
    id: id(),
    userId: ref('user_id').notNull().references(() => users.id, { onDelete: 'cascade' }),
    idHash: varchar('id_hash', { length: 64 }).notNull().unique(),
    createdAt: timestamp('created_at').notNull().defaultNow(),
    /** Updated at most once a minute, so a busy page does not write on every request. */
    lastSeenAt: timestamp('last_seen_at').notNull().defaultNow(),
    expiresAt: timestamp('expires_at').notNull(),
    revokedAt: timestamp('revoked_at'),
    /** A short description of the browser ("Firefox on Linux"), for the list of one's own sessions. */
    userAgent: varchar('user_agent', { length: 120 }).notNull().default(''),
  },
  (t) => [index('sessions_user').on(t.userId)],
);

/**
 * Counters behind the rate limits (failed sign-ins per address and per account, reset requests,
 * shared-link reads), in the database so that every server process sharing it sees the same counts.
 * No index on the times: the sweep of spent rows is rare, and every hit would have to update it.
 */
export const rateCounters = mysqlTable('rate_counters', {
  /** What is counted and for whom, e.g. `login-ip:192.0.2.7` or `login-account:<sha256 of the e-mail>`. */
  counterKey: varchar('counter_key', { length: 120 }).primaryKey(),
  hits: int('hits', { unsigned: true }).notNull().default(0),
  // An explicit default: on a server with explicit_defaults_for_timestamp off, the first NOT NULL
  // timestamp of a table would otherwise be set to the current time by every UPDATE.
  windowEndsAt: timestamp('window_ends_at', { fsp: 3 }).notNull().default(sql`CURRENT_TIMESTAMP(3)`),
  /** For spaced attempts (one account's sign-ins): the next attempt is answered only from this time on. */
  nextAllowedAt: timestamp('next_allowed_at', { fsp: 3 }),
});

/**
 * API tokens for scripts and test rigs (`Authorization: Bearer crl_…`). Only the SHA-256 of a token is
 * kept; it is looked up by that hash, so comparing never runs over secret bytes one by one.
 */
export const apiTokens = mysqlTable(
  'api_tokens',
  {
    id: id(),
    userId: ref('user_id').notNull().references(() => users.id, { onDelete: 'cascade' }),
    name: varchar('name', { length: 120 }).notNull(),
    tokenHash: varchar('token_hash', { length: 64 }).notNull().unique(),
    /** The token's last four characters, so its owner can tell tokens apart; 168 random bits stay unknown. */
    hint: varchar('hint', { length: 8 }).notNull(),
    readOnly: boolean('read_only').notNull().default(false),
    createdAt: timestamp('created_at').notNull().defaultNow(),
    /** Updated at most once a minute, so a busy rig does not write on every request. */
    lastUsedAt: timestamp('last_used_at'),
    expiresAt: timestamp('expires_at').notNull(),
  },
  (t) => [index('api_tokens_user').on(t.userId)],
);

/** A project's named probes and clamps, applied to a channel in one click (e.g. "clamp 100 mV/A → A"). */
export const probePresets = mysqlTable(
  'probe_presets',
  {
    id: id(),
    projectId: ref('project_id').notNull().references(() => projects.id, { onDelete: 'cascade' }),
    name: varchar('name', { length: 80 }).notNull(),
    unit: varchar('unit', { length: 8 }).notNull(),
    scale: double('scale').notNull(),
    offset: double('offset').notNull().default(0),
    invert: boolean('invert').notNull().default(false),
    createdBy: ref('created_by').references(() => users.id),
    createdAt: timestamp('created_at').notNull().defaultNow(),
  },
  (t) => [index('probe_presets_project').on(t.projectId)],
);

/** A meter's front end saved for a project's team, or in one person's account. */
export const meterProfiles = mysqlTable(
  'meter_profiles',
  {
    id: id(),
    name: varchar('name', { length: 120 }).notNull(),
    scope: mysqlEnum('scope', ['project', 'account']).notNull(),
    /** The project of a project profile; null for an account profile. */
    projectId: ref('project_id').references(() => projects.id, { onDelete: 'cascade' }),
    /** Its creator, who owns it when it is an account profile. */
    createdBy: ref('created_by').notNull().references(() => users.id, { onDelete: 'cascade' }),
    profile: json('profile').$type<FrontEndProfile>().notNull(),
    createdAt: timestamp('created_at').notNull().defaultNow(),
  },
  (t) => [index('meter_profiles_project').on(t.projectId), index('meter_profiles_creator').on(t.createdBy)],
);
