import {
  mysqlTable,
  varchar,
  int,
  datetime,
  text,
  double,
  mysqlEnum,
  boolean,
  primaryKey,
  index,
  uniqueIndex,
  customType,
  bigint,
} from 'drizzle-orm/mysql-core';

/**
 * JSON kept as LONGTEXT. MariaDB's JSON type is an alias of LONGTEXT and mysql2
 * hands it back as a string, so the column parses it on the way out itself.
 */
export const jsonText = <T>(name: string) =>
  customType<{ data: T; driverData: string }>({
    dataType: () => 'longtext',
    toDriver: (value) => JSON.stringify(value),
    fromDriver: (value) => (typeof value === 'string' ? (JSON.parse(value) as T) : (value as T)),
  })(name);

/** bytes kept as MEDIUMBLOB (up to 16 MB): a packed kept run (src/lib/workbench/keptRun.ts) */
export const packedBytes = (name: string) =>
  customType<{ data: Buffer; driverData: Buffer }>({
    dataType: () => 'mediumblob',
    toDriver: (value) => value,
    fromDriver: (value) => (Buffer.isBuffer(value) ? value : Buffer.from(value as Uint8Array)),
  })(name);

const now = (name: string) => datetime(name, { mode: 'date', fsp: 3 }).notNull().$defaultFn(() => new Date());

export const roles = ['admin', 'engineer', 'checker'] as const;
export type Role = (typeof roles)[number];

export const revisionStates = ['draft', 'in_check', 'checked', 'sent_back', 'issued'] as const;
export type RevisionState = (typeof revisionStates)[number];

export const materialClasses = [
  'masonry',
  'concrete',
  'timber',
  'insulation',
  'board',
  'metal',
  'membrane',
  'air',
  'render',
] as const;
export type MaterialClass = (typeof materialClasses)[number];

// --- accounts (lucia v3 drizzle adapter wants users.id and sessions in this shape) ---

export const users = mysqlTable(
  'users',
  {
    id: varchar('id', { length: 255 }).primaryKey(),
    email: varchar('email', { length: 255 }).notNull(),
    name: varchar('name', { length: 120 }).notNull(),
    passwordHash: varchar('password_hash', { length: 255 }).notNull(),
    emailVerifiedAt: datetime('email_verified_at', { mode: 'date', fsp: 3 }),
    createdAt: now('created_at'),
  },
  (t) => [uniqueIndex('users_email_uq').on(t.email)],
);

export const sessions = mysqlTable('sessions', {
  id: varchar('id', { length: 255 }).primaryKey(),
  userId: varchar('user_id', { length: 255 })
    .notNull()
    .references(() => users.id, { onDelete: 'cascade' }),
  expiresAt: datetime('expires_at').notNull(),
});

/** single-use tokens sent by e-mail: address verification and password reset; only the hash is kept */
export const emailTokens = mysqlTable(
  'email_tokens',
  {
    id: int('id').autoincrement().primaryKey(),
    userId: varchar('user_id', { length: 255 })
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    purpose: mysqlEnum('purpose', ['verify', 'reset']).notNull(),
    tokenHash: varchar('token_hash', { length: 64 }).notNull(),
    expiresAt: datetime('expires_at', { mode: 'date', fsp: 3 }).notNull(),
    usedAt: datetime('used_at', { mode: 'date', fsp: 3 }),
    createdAt: now('created_at'),
  },
  (t) => [uniqueIndex('email_tokens_hash_uq').on(t.tokenHash)],
);

// --- teams ---

export const teams = mysqlTable('teams', {
  id: int('id').autoincrement().primaryKey(),
  name: varchar('name', { length: 120 }).notNull(),
  createdAt: now('created_at'),
});

export const memberships = mysqlTable(
  'memberships',
  {
    teamId: int('team_id')
      .notNull()
      .references(() => teams.id, { onDelete: 'cascade' }),
    userId: varchar('user_id', { length: 255 })
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    role: mysqlEnum('role', roles).notNull(),
    createdAt: now('created_at'),
  },
  (t) => [primaryKey({ columns: [t.teamId, t.userId] }), index('memberships_user_idx').on(t.userId)],
);

export const invitations = mysqlTable(
  'invitations',
  {
    id: int('id').autoincrement().primaryKey(),
    teamId: int('team_id')
      .notNull()
      .references(() => teams.id, { onDelete: 'cascade' }),
    email: varchar('email', { length: 255 }).notNull(),
    role: mysqlEnum('role', roles).notNull(),
    tokenHash: varchar('token_hash', { length: 64 }).notNull(),
    invitedBy: varchar('invited_by', { length: 255 }).references(() => users.id, { onDelete: 'set null' }),
    expiresAt: datetime('expires_at', { mode: 'date', fsp: 3 }).notNull(),
    acceptedAt: datetime('accepted_at', { mode: 'date', fsp: 3 }),
    revokedAt: datetime('revoked_at', { mode: 'date', fsp: 3 }),
    createdAt: now('created_at'),
  },
  (t) => [uniqueIndex('invitations_hash_uq').on(t.tokenHash), index('invitations_team_idx').on(t.teamId)],
);

// --- saved work: jobs -> assemblies -> revisions -> runs ---

export const jobs = mysqlTable(
  'jobs',
  {
    id: int('id').autoincrement().primaryKey(),
    teamId: int('team_id')
      .notNull()
      .references(() => teams.id, { onDelete: 'cascade' }),
    name: varchar('name', { length: 160 }).notNull(),
    reference: varchar('reference', { length: 60 }).notNull().default(''),
    client: varchar('client', { length: 160 }).notNull().default(''),
    location: varchar('location', { length: 160 }).notNull().default(''),
    notes: text('notes').notNull().default(''),
    createdBy: varchar('created_by', { length: 255 }).references(() => users.id, { onDelete: 'set null' }),
    createdAt: now('created_at'),
    updatedAt: now('updated_at'),
  },
  (t) => [index('jobs_team_idx').on(t.teamId)],
);

export const assemblies = mysqlTable(
  'assemblies',
  {
    id: int('id').autoincrement().primaryKey(),
    jobId: int('job_id')
      .notNull()
      .references(() => jobs.id, { onDelete: 'cascade' }),
    name: varchar('name', { length: 160 }).notNull(),
    /** wall, roof or floor: sets the default inside surface resistance (heat-flow direction) */
    element: mysqlEnum('element', ['wall', 'roof', 'floor']).notNull().default('wall'),
    description: text('description').notNull().default(''),
    createdBy: varchar('created_by', { length: 255 }).references(() => users.id, { onDelete: 'set null' }),
    createdAt: now('created_at'),
    updatedAt: now('updated_at'),
  },
  (t) => [index('assemblies_job_idx').on(t.jobId)],
);

/** each save of the workbench; immutable once written (only its state moves) */
export const revisions = mysqlTable(
  'revisions',
  {
    id: int('id').autoincrement().primaryKey(),
    assemblyId: int('assembly_id')
      .notNull()
      .references(() => assemblies.id, { onDelete: 'cascade' }),
    number: int('number').notNull(),
    parentId: int('parent_id'),
    /** the workbench document: engine model plus names, material ids, notes and exposure settings */
    model: jsonText<unknown>('model').notNull(),
    note: text('note').notNull().default(''),
    state: mysqlEnum('state', revisionStates).notNull().default('draft'),
    authorId: varchar('author_id', { length: 255 }).references(() => users.id, { onDelete: 'set null' }),
    createdAt: now('created_at'),
  },
  (t) => [uniqueIndex('revisions_assembly_number_uq').on(t.assemblyId, t.number)],
);

/** the history of a revision's states: who moved it, when, and why */
export const revisionEvents = mysqlTable(
  'revision_events',
  {
    id: int('id').autoincrement().primaryKey(),
    revisionId: int('revision_id')
      .notNull()
      .references(() => revisions.id, { onDelete: 'cascade' }),
    fromState: mysqlEnum('from_state', revisionStates),
    toState: mysqlEnum('to_state', revisionStates).notNull(),
    actorId: varchar('actor_id', { length: 255 }).references(() => users.id, { onDelete: 'set null' }),
    note: text('note').notNull().default(''),
    createdAt: now('created_at'),
  },
  (t) => [index('revision_events_revision_idx').on(t.revisionId)],
);

export const runs = mysqlTable(
  'runs',
  {
    id: int('id').autoincrement().primaryKey(),
    revisionId: int('revision_id')
      .notNull()
      .references(() => revisions.id, { onDelete: 'cascade' }),
    exposure: jsonText<unknown>('exposure').notNull(),
    summary: jsonText<unknown>('summary').notNull(),
    /** the run packed (series as Float32 columns, zlib-compressed, figures in a header); null when kept without its series */
    packed: packedBytes('packed'),
    createdBy: varchar('created_by', { length: 255 }).references(() => users.id, { onDelete: 'set null' }),
    createdAt: now('created_at'),
  },
  (t) => [index('runs_revision_idx').on(t.revisionId)],
);

export const comments = mysqlTable(
  'comments',
  {
    id: int('id').autoincrement().primaryKey(),
    revisionId: int('revision_id')
      .notNull()
      .references(() => revisions.id, { onDelete: 'cascade' }),
    authorId: varchar('author_id', { length: 255 }).references(() => users.id, { onDelete: 'set null' }),
    body: text('body').notNull(),
    createdAt: now('created_at'),
  },
  (t) => [index('comments_revision_idx').on(t.revisionId)],
);

export const shareLinks = mysqlTable(
  'share_links',
  {
    id: int('id').autoincrement().primaryKey(),
    revisionId: int('revision_id')
      .notNull()
      .references(() => revisions.id, { onDelete: 'cascade' }),
    tokenHash: varchar('token_hash', { length: 64 }).notNull(),
    label: varchar('label', { length: 160 }).notNull().default(''),
    createdBy: varchar('created_by', { length: 255 }).references(() => users.id, { onDelete: 'set null' }),
    expiresAt: datetime('expires_at', { mode: 'date', fsp: 3 }),
    revokedAt: datetime('revoked_at', { mode: 'date', fsp: 3 }),
    lastOpenedAt: datetime('last_opened_at', { mode: 'date', fsp: 3 }),
    openCount: int('open_count').notNull().default(0),
    createdAt: now('created_at'),
  },
  (t) => [uniqueIndex('share_links_hash_uq').on(t.tokenHash), index('share_links_revision_idx').on(t.revisionId)],
);

// --- library and uploads ---

/** teamId null marks a built-in material, shipped with the app and read-only */
export const materials = mysqlTable(
  'materials',
  {
    id: int('id').autoincrement().primaryKey(),
    teamId: int('team_id').references(() => teams.id, { onDelete: 'cascade' }),
    /** stable key of a built-in material (null for a team's own) */
    builtinKey: varchar('builtin_key', { length: 80 }),
    name: varchar('name', { length: 160 }).notNull(),
    materialClass: mysqlEnum('material_class', materialClasses).notNull(),
    /** W/(m·K) */
    conductivity: double('conductivity').notNull(),
    /** kg/m³ */
    density: double('density').notNull(),
    /** J/(kg·K) */
    specificHeat: double('specific_heat').notNull(),
    /** water-vapour resistance factor μ, dimensionless */
    vapourResistanceFactor: double('vapour_resistance_factor').notNull(),
    source: text('source').notNull(),
    notes: text('notes').notNull().default(''),
    createdBy: varchar('created_by', { length: 255 }).references(() => users.id, { onDelete: 'set null' }),
    createdAt: now('created_at'),
    updatedAt: now('updated_at'),
  },
  (t) => [index('materials_team_idx').on(t.teamId), uniqueIndex('materials_builtin_uq').on(t.builtinKey)],
);

/** an hourly outdoor series uploaded as CSV, after mapping and validation */
export const uploads = mysqlTable(
  'uploads',
  {
    id: int('id').autoincrement().primaryKey(),
    teamId: int('team_id')
      .notNull()
      .references(() => teams.id, { onDelete: 'cascade' }),
    name: varchar('name', { length: 160 }).notNull(),
    fileName: varchar('file_name', { length: 255 }).notNull(),
    /** column mapping and units chosen at import */
    mapping: jsonText<unknown>('mapping').notNull(),
    /** { step: s, air: °C[], irradiance?: W/m²[] } */
    series: jsonText<unknown>('series').notNull(),
    rowCount: int('row_count').notNull(),
    createdBy: varchar('created_by', { length: 255 }).references(() => users.id, { onDelete: 'set null' }),
    createdAt: now('created_at'),
  },
  (t) => [index('uploads_team_idx').on(t.teamId)],
);

// --- mail and audit ---

/**
 * The outbound mail queue: a request writes a row (queued) and answers at once; the worker in
 * mail.ts claims due rows (locked_until, so several app instances never send one twice),
 * sends them, and marks them sent, or tries again later with a growing wait until it gives up (failed).
 */
export const outboundMail = mysqlTable(
  'outbound_mail',
  {
    id: int('id').autoincrement().primaryKey(),
    toAddress: varchar('to_address', { length: 255 }).notNull(),
    subject: varchar('subject', { length: 255 }).notNull(),
    purpose: varchar('purpose', { length: 40 }).notNull(),
    status: mysqlEnum('status', ['queued', 'sent', 'failed']).notNull(),
    textBody: text('text_body').notNull().default(''),
    htmlBody: text('html_body'),
    /** sending attempts made so far */
    attempts: int('attempts').notNull().default(0),
    /** when the worker may try it (again) */
    nextAttemptAt: now('next_attempt_at'),
    /** a worker holds it until then; the claim's id says which */
    lockedUntil: datetime('locked_until', { mode: 'date', fsp: 3 }),
    lockId: varchar('lock_id', { length: 32 }),
    sentAt: datetime('sent_at', { mode: 'date', fsp: 3 }),
    messageId: varchar('message_id', { length: 255 }),
    error: text('error'),
    createdAt: now('created_at'),
  },
  (t) => [index('outbound_mail_due_idx').on(t.status, t.nextAttemptAt)],
);

/**
 * Request limits (sign-in failures, reset and sign-up requests...) kept by rate-limiter-flexible's
 * MySQL store, in the table layout it expects, so every app instance counts together.
 */
export const rateLimits = mysqlTable('rate_limits', {
  key: varchar('key', { length: 255 }).primaryKey(),
  points: int('points').notNull().default(0),
  /** when the window ends, ms since 1970 */
  expire: bigint('expire', { mode: 'number', unsigned: true }),
});

/** what the local fake SMTP server received; tests and the developer read mail here */
export const smtpInbox = mysqlTable(
  'smtp_inbox',
  {
    id: int('id').autoincrement().primaryKey(),
    envelopeFrom: varchar('envelope_from', { length: 255 }).notNull(),
    envelopeTo: varchar('envelope_to', { length: 1000 }).notNull(),
    subject: varchar('subject', { length: 255 }).notNull().default(''),
    textBody: text('text_body').notNull(),
    htmlBody: text('html_body'),
    raw: text('raw').notNull(),
    receivedAt: now('received_at'),
  },
  (t) => [index('smtp_inbox_to_idx').on(t.envelopeTo)],
);

export const auditLog = mysqlTable(
  'audit_log',
  {
    id: int('id').autoincrement().primaryKey(),
    teamId: int('team_id').references(() => teams.id, { onDelete: 'cascade' }),
    actorId: varchar('actor_id', { length: 255 }).references(() => users.id, { onDelete: 'set null' }),
    /** e.g. sign_in, sign_in_failed, role_changed, share_created, share_opened, share_revoked */
    action: varchar('action', { length: 64 }).notNull(),
    target: varchar('target', { length: 255 }).notNull().default(''),
    detail: jsonText<Record<string, unknown>>('detail'),
    ip: varchar('ip', { length: 64 }).notNull().default(''),
    success: boolean('success').notNull().default(true),
    createdAt: now('created_at'),
  },
  (t) => [index('audit_team_idx').on(t.teamId, t.createdAt)],
);

export type User = typeof users.$inferSelect;
export type Team = typeof teams.$inferSelect;
export type Membership = typeof memberships.$inferSelect;
export type Job = typeof jobs.$inferSelect;
export type Assembly = typeof assemblies.$inferSelect;
export type Revision = typeof revisions.$inferSelect;
export type Run = typeof runs.$inferSelect;
export type Material = typeof materials.$inferSelect;
export type NewMaterial = typeof materials.$inferInsert;
export type Upload = typeof uploads.$inferSelect;
