// Long file: the whole database schema in one module, as drizzle-kit reads it to generate migrations.
import { relations, sql } from "drizzle-orm";
import {
  boolean,
  check,
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
} from "drizzle-orm/pg-core";
// Types only (erased at run time): what a JSON column holds, so every read is typed without a cast.
import type { CaptureMapping } from "@/lib/capture/parse";
import type { DecisionSnapshot } from "@/lib/projects/decisions";
import type { Finding } from "@/lib/soa/findings";
import type { PulseResult } from "@/lib/soa/types";

// Tables ----------------------------------------------------------------------------------------------------

// Columns that many tables share, spread into them; drizzle builds each table's own column, named by the key.
const rowId = { id: uuid().primaryKey().defaultRandom() };
const created = { createdAt: timestamp({ withTimezone: true }).notNull().defaultNow() };
const updated = { updatedAt: timestamp({ withTimezone: true }).notNull().defaultNow() };

export const roleEnum = pgEnum("member_role", ["admin", "lead", "engineer", "technician"]);

/** A team. Every row of every later table hangs off a workspace. */
export const workspaces = pgTable("workspaces", {
  ...rowId,
  name: text().notNull(),
  slug: text().notNull().unique(),
  ...created,
});

/**
 * A person. E-mail addresses are stored lower-cased. The `notice…` flags are the person's choice of optional
 * e-mails (account mail such as invitations and reset links is always sent); all are on for a new account.
 */
export const users = pgTable("users", {
  ...rowId,
  email: text().notNull().unique(),
  name: text().notNull(),
  passwordHash: text().notNull(),
  /** Measured pulses and captures that fail or have no data, on projects the person owns. */
  noticeFailingEvidence: boolean().notNull().default(true),
  /** A standing decision the person signed, or on a project they own, drifts after a library change. */
  noticeDecisionDrift: boolean().notNull().default(true),
  /** A part the person verified returns to draft because its data changed. */
  noticeVerificationLapsed: boolean().notNull().default(true),
  ...created,
});

/** The workspace a row belongs to; deleting the workspace deletes the row. */
const inWorkspace = {
  workspaceId: uuid()
    .notNull()
    .references(() => workspaces.id, { onDelete: "cascade" }),
};
/** Who made a row (kept when that person's account goes) and when. */
const authored = { createdBy: uuid().references(() => users.id, { onDelete: "set null" }), ...created };

/**
 * A sign-up waiting for its address to be confirmed: the account and its workspace are created only when the link
 * e-mailed to the address is used, so the sign-up form answers the same whether or not the address has an account.
 * The token is stored hashed, as reset links are.
 */
export const pendingSignUps = pgTable(
  "pending_sign_ups",
  {
    ...rowId,
    email: text().notNull(),
    name: text().notNull(),
    passwordHash: text().notNull(),
    workspaceName: text().notNull(),
    tokenHash: text().notNull().unique(),
    expiresAt: timestamp({ withTimezone: true }).notNull(),
    ...created,
  },
  (t) => [index().on(t.expiresAt)],
);

/**
 * A signed-in browser. The id is the SHA-256 of the cookie's token (a stolen table signs no one in); the active
 * workspace travels with it. `expiresAt` slides with use; `createdAt` caps the session's life however it is used.
 */
export const sessions = pgTable(
  "sessions",
  {
    id: text().primaryKey(),
    userId: uuid()
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    workspaceId: uuid().references(() => workspaces.id, { onDelete: "set null" }),
    expiresAt: timestamp({ withTimezone: true, mode: "date" }).notNull(),
    createdAt: timestamp({ withTimezone: true, mode: "date" }).notNull().defaultNow(),
  },
  (t) => [index().on(t.userId)],
);

export const memberships = pgTable(
  "memberships",
  {
    ...inWorkspace,
    userId: uuid()
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    role: roleEnum().notNull(),
    /** Lead rights beside the role (src/lib/auth/permissions.ts), granted by an admin: one-person teams. */
    leadRights: boolean().notNull().default(false),
    ...created,
  },
  (t) => [primaryKey({ columns: [t.workspaceId, t.userId] }), index().on(t.userId)],
);

/** An invitation by e-mail; the token is random and stored only as its SHA-256. */
export const invitations = pgTable(
  "invitations",
  {
    ...rowId,
    ...inWorkspace,
    email: text().notNull(),
    role: roleEnum().notNull(),
    tokenHash: text().notNull().unique(),
    invitedBy: uuid().references(() => users.id, { onDelete: "set null" }),
    expiresAt: timestamp({ withTimezone: true }).notNull(),
    acceptedAt: timestamp({ withTimezone: true }),
    revokedAt: timestamp({ withTimezone: true }),
    ...created,
  },
  (t) => [index().on(t.workspaceId)],
);

/** A password-reset request; same token rules as invitations. */
export const passwordResets = pgTable("password_resets", {
  ...rowId,
  userId: uuid()
    .notNull()
    .references(() => users.id, { onDelete: "cascade" }),
  tokenHash: text().notNull().unique(),
  expiresAt: timestamp({ withTimezone: true }).notNull(),
  usedAt: timestamp({ withTimezone: true }),
  ...created,
});

/** A bearer token for bench scripts, acting as its user in one workspace. Stored hashed; shown once. */
export const apiTokens = pgTable(
  "api_tokens",
  {
    ...rowId,
    userId: uuid()
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    ...inWorkspace,
    name: text().notNull(),
    tokenHash: text().notNull().unique(),
    prefix: text().notNull(),
    /** Tokens expire (90 days unless given otherwise); a password reset or sign-out everywhere revokes them. */
    expiresAt: timestamp({ withTimezone: true }).notNull().default(sql`now() + interval '90 days'`),
    lastUsedAt: timestamp({ withTimezone: true }),
    revokedAt: timestamp({ withTimezone: true }),
    ...created,
  },
  (t) => [index().on(t.userId)],
);

/** Failed sign-ins and reset requests, counted per e-mail and per IP to throttle guessing. */
export const authAttempts = pgTable(
  "auth_attempts",
  {
    ...rowId,
    kind: text({ enum: ["sign-in", "reset", "reset-use", "sign-up"] }).notNull(),
    key: text().notNull(),
    ...created,
  },
  (t) => [index().on(t.kind, t.key, t.createdAt)],
);

/** Who did what, when: membership, role, token changes and, later, project history. */
export const auditEvents = pgTable(
  "audit_events",
  {
    ...rowId,
    ...inWorkspace,
    actorId: uuid().references(() => users.id, { onDelete: "set null" }),
    action: text().notNull(),
    subjectType: text().notNull(),
    subjectId: text(),
    details: jsonb().$type<Record<string, unknown>>().notNull().default({}),
    ...created,
  },
  (t) => [index().on(t.workspaceId, t.createdAt)],
);

// Library -----------------------------------------------------------------------------------------------------

export const technologyEnum = pgEnum("part_technology", ["si-mosfet", "sic-mosfet", "gan-hemt", "igbt"]);
export const partStatusEnum = pgEnum("part_status", ["draft", "verified"]);

export interface FosterTermRow {
  r: number;
  tau: number;
}

/** How a part's Foster network was obtained: typed or pasted, or fitted to an uploaded Z_th(t) curve. */
export interface ThermalSource {
  kind: "typed" | "fitted";
  fileName?: string;
  objectKey?: string;
  points?: [number, number][];
  rmsRelativeError?: number;
  maxRelativeError?: number;
}

/** A part's transfer characteristics as stored: the engine's two curves and the file or paste they came from. */
export interface TransferRow {
  temps: [number, number];
  curves: [[number, number][], [number, number][]];
  source: { kind: "typed" | "uploaded"; fileName?: string };
}

/** A curve-set finding a lead accepted when verifying the part: the finding's key and message, and why. */
export interface FindingAcceptance {
  key: string;
  message: string;
  reason: string;
}

/** A transistor of the workspace's library. Ratings in SI units (V, A, Ω, °C, K/W). */
export const parts = pgTable(
  "parts",
  {
    ...rowId,
    ...inWorkspace,
    partNumber: text().notNull(),
    maker: text().notNull(),
    technology: technologyEnum().notNull(),
    package: text().notNull(),
    vdsMax: doublePrecision().notNull(),
    idMax: doublePrecision(),
    idPulseMax: doublePrecision(),
    rdsOn: doublePrecision(),
    tjMax: doublePrecision().notNull(),
    rthJc: doublePrecision(),
    foster: jsonb().$type<FosterTermRow[]>(),
    thermalSource: jsonb().$type<ThermalSource>(),
    /** Typical transfer characteristics at two junction temperatures (METHODS.md §12), with where they came from. */
    transfer: jsonb().$type<TransferRow>(),
    /** Single-pulse avalanche energy E_AS at 25 °C start (J), its current I_AS (A) and breakdown V_BR (V): §13. */
    avalancheEnergy: doublePrecision(),
    avalancheCurrent: doublePrecision(),
    avalancheBreakdown: doublePrecision(),
    unitCost: doublePrecision(),
    currency: text(),
    datasheetRevision: text(),
    notes: text(),
    status: partStatusEnum().notNull().default("draft"),
    verifiedBy: uuid().references(() => users.id, { onDelete: "set null" }),
    verifiedAt: timestamp({ withTimezone: true }),
    /** The findings the verifier accepted, each with a reason; cleared when the part returns to draft. */
    acceptedFindings: jsonb().$type<FindingAcceptance[]>().notNull().default([]),
    archivedAt: timestamp({ withTimezone: true }),
    ...authored,
    ...updated,
  },
  (t) => [uniqueIndex().on(t.workspaceId, t.maker, t.partNumber), index().on(t.workspaceId, t.partNumber)],
);

/** One uploaded SOA figure of a part (a datasheet revision). The raw file stays in object storage. */
export const curveSets = pgTable(
  "curve_sets",
  {
    ...rowId,
    ...inWorkspace,
    partId: uuid()
      .notNull()
      .references(() => parts.id, { onDelete: "cascade" }),
    objectKey: text().notNull().unique(),
    fileName: text().notNull(),
    size: integer().notNull(),
    sha256: text().notNull(),
    shape: text({ enum: ["long", "paired"] }).notNull(),
    refCaseTemp: doublePrecision().notNull().default(25),
    active: boolean().notNull().default(false),
    findings: jsonb().$type<Finding[]>().notNull().default([]),
    uploadedBy: uuid().references(() => users.id, { onDelete: "set null" }),
    ...created,
  },
  (t) => [index().on(t.partId)],
);

/** One SOA curve of a curve set: duration in seconds, null for DC; points [V, I] sorted by V. */
export const curves = pgTable(
  "curves",
  {
    ...rowId,
    curveSetId: uuid()
      .notNull()
      .references(() => curveSets.id, { onDelete: "cascade" }),
    position: integer().notNull(),
    duration: doublePrecision(),
    points: jsonb().$type<[number, number][]>().notNull(),
  },
  (t) => [index().on(t.curveSetId)],
);

/** A presigned upload not yet registered; a cleanup step removes the objects of stale ones. */
export const pendingUploads = pgTable("pending_uploads", {
  ...rowId,
  ...inWorkspace,
  userId: uuid().references(() => users.id, { onDelete: "set null" }),
  objectKey: text().notNull().unique(),
  fileName: text().notNull(),
  purpose: text().notNull(),
  ...created,
});

// Projects ----------------------------------------------------------------------------------------------------

export const pulseKindEnum = pgEnum("pulse_kind", ["rect", "triangle"]);
/** A fault case's shape: a measured pulse's, or an unclamped turn-off (METHODS.md §13), or a fault sequence. */
export const faultCaseKindEnum = pgEnum("fault_case_kind", ["rect", "triangle", "avalanche", "waveform"]);
export const betweenCurvesEnum = pgEnum("between_curves", ["loglog", "next-longer", "thermal"]);
/** What came before a capture's record (METHODS.md §6); null: the engine decides from the data. */
export const recordStartEnum = pgEnum("record_start", ["rest", "steady"]);

/** One design under review: the case temperature to assume, the margin policy, its candidates and pulses. */
export const projects = pgTable(
  "projects",
  {
    ...rowId,
    ...inWorkspace,
    name: text().notNull(),
    description: text(),
    caseTemp: doublePrecision().notNull().default(25),
    utilisationLimit: doublePrecision().notNull().default(0.8),
    tjGuard: doublePrecision().notNull().default(25),
    voltageLimit: doublePrecision().notNull().default(0.8),
    betweenCurves: betweenCurvesEnum().notNull().default("loglog"),
    /** Case-to-ambient Foster network (METHODS.md §14), and whether checks heat the case through it. */
    caseNetwork: jsonb().$type<FosterTermRow[]>(),
    applyCaseNetwork: boolean().notNull().default(false),
    ownerId: uuid().references(() => users.id, { onDelete: "set null" }),
    archivedAt: timestamp({ withTimezone: true }),
    ...created,
    ...updated,
  },
  (t) => [index().on(t.workspaceId)],
);

/** The project a row belongs to; deleting the project deletes the row. */
const inProject = {
  projectId: uuid()
    .notNull()
    .references(() => projects.id, { onDelete: "cascade" }),
};

export const projectCandidates = pgTable(
  "project_candidates",
  {
    ...inProject,
    partId: uuid()
      .notNull()
      .references(() => parts.id, { onDelete: "cascade" }),
    addedAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [primaryKey({ columns: [t.projectId, t.partId] })],
);

/** How a pulse was obtained when a pulse builder made it: the builder, its inputs and intermediate figures. */
export interface PulseOrigin {
  builder: string;
  input: Record<string, unknown>;
  figures: Record<string, unknown>;
}

/** A fault sequence's samples, built from its pieces (a waveform pulse, METHODS.md §6): time (s), V and A. */
export interface FaultCaseSamples {
  t: number[];
  v: number[];
  i: number[];
}

/**
 * A pulse the design must survive, from a calculation, SI units. Rectangle or triangle (falling): V, I (peak) and
 * duration, optional repetition (period, count; no count = continuous). Avalanche (an unclamped turn-off,
 * METHODS.md §13): V is the supply, I the current cut, and the inductance; no duration. Waveform (a fault
 * sequence): the samples, with V and I of the peak-power sample for display; no duration. Optional case temperature.
 */
export const faultCases = pgTable(
  "fault_cases",
  {
    ...rowId,
    ...inProject,
    name: text().notNull(),
    kind: faultCaseKindEnum().notNull(),
    v: doublePrecision().notNull(),
    i: doublePrecision().notNull(),
    duration: doublePrecision(),
    inductance: doublePrecision(),
    samples: jsonb().$type<FaultCaseSamples>(),
    repeatPeriod: doublePrecision(),
    repeatCount: integer(),
    caseTemp: doublePrecision(),
    origin: jsonb().$type<PulseOrigin>(),
    notes: text(),
    ...authored,
    ...updated,
  },
  (t) => [
    index().on(t.projectId),
    check(
      "fault_cases_shape",
      sql`(${t.kind} in ('rect', 'triangle') and ${t.duration} is not null and ${t.inductance} is null and ${t.samples} is null)
        or (${t.kind} = 'avalanche' and ${t.inductance} is not null and ${t.duration} is null and ${t.samples} is null and ${t.repeatPeriod} is null)
        or (${t.kind} = 'waveform' and ${t.samples} is not null and ${t.duration} is null and ${t.inductance} is null and ${t.repeatPeriod} is null)`,
    ),
  ],
);

/** A pulse the bench measured, logged by a technician (or anyone allowed to), with its bench setup. */
export const measuredPulses = pgTable(
  "measured_pulses",
  {
    ...rowId,
    ...inProject,
    label: text().notNull(),
    kind: pulseKindEnum().notNull(),
    v: doublePrecision().notNull(),
    i: doublePrecision().notNull(),
    duration: doublePrecision().notNull(),
    repeatPeriod: doublePrecision(),
    repeatCount: integer(),
    note: text(),
    boardSerial: text(),
    probe: text(),
    ...authored,
  },
  (t) => [index().on(t.projectId)],
);

/** What the server computed from a capture, kept for display; the samples stay in object storage. */
export interface CaptureSummary {
  samples: number;
  uniform: boolean;
  tStart: number;
  tEnd: number;
  vMax: number;
  iMaxAbs: number;
  pPeak: number;
  tPeak: number;
  energy: number;
  /** The equal-energy rectangle at peak power (METHODS.md §6), or why there is none. */
  equivalent: { ok: true; v: number; i: number; duration: number } | { ok: false; flag: string };
}

/** A min/max-decimated trace for drawing: for each bucket its time and the min and max of each series. */
export interface CaptureTrace {
  t: number[];
  v: [number, number][];
  i: [number, number][];
  p: [number, number][];
}

/** Where a capture's processing job stands (src/lib/capture/job.ts). */
export const captureStatusEnum = pgEnum("capture_status", ["queued", "processing", "done", "failed"]);

/**
 * A scope capture: the uploaded CSV and the parsed samples (binary) in storage, the summary here. A capture is
 * registered as `queued` with its CSV kept and its keys reserved; a job parses it, stores the samples, and writes
 * the summary, the drawn trace and its results per candidate (capture_results) in one transaction (`done`), or
 * says what failed and where (`failed`). Summary, trace and SHA-256 are null until then.
 */
export const captures = pgTable(
  "captures",
  {
    ...rowId,
    ...inProject,
    name: text().notNull(),
    objectKey: text().notNull().unique(),
    samplesKey: text().notNull().unique(),
    fileName: text().notNull(),
    size: integer().notNull(),
    sha256: text(),
    mapping: jsonb().$type<CaptureMapping>().notNull(),
    summary: jsonb().$type<CaptureSummary>(),
    trace: jsonb().$type<CaptureTrace>(),
    status: captureStatusEnum().notNull().default("done"),
    /** Why the last attempt failed, said for the page (what and where); null when none did. */
    error: text(),
    attempts: integer().notNull().default(0),
    processedAt: timestamp({ withTimezone: true }),
    start: recordStartEnum(),
    note: text(),
    boardSerial: text(),
    probe: text(),
    ...authored,
  },
  (t) => [index().on(t.projectId)],
);

/** A decimated junction-temperature trace of a capture on one candidate, kept for display. */
export interface StoredJunction {
  tjPeak: number;
  tPeak: number;
  start: "rest" | "steady";
  trace: { t: number[]; y: [number, number][] };
}

/**
 * A capture's check on one candidate, stored when its job finishes so that viewing the capture never reloads its
 * samples. `fingerprint` hashes every input the result rests on (the candidate's limits, the project's case
 * temperature, margin policy and case path, the capture's start): a result whose fingerprint differs from the
 * current inputs' is stale, is never shown as current, and is recomputed by a job (src/lib/capture/results.ts).
 */
export const captureResults = pgTable(
  "capture_results",
  {
    captureId: uuid()
      .notNull()
      .references(() => captures.id, { onDelete: "cascade" }),
    partId: uuid()
      .notNull()
      .references(() => parts.id, { onDelete: "cascade" }),
    fingerprint: text().notNull(),
    /** The engine's result; null when the candidate has no SOA curves (no data). */
    result: jsonb().$type<PulseResult>(),
    junction: jsonb().$type<StoredJunction>(),
    /** The case temperature through the capture when the project applies its case path (the same on every row). */
    caseTrace: jsonb().$type<StoredJunction>(),
    computedAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [primaryKey({ columns: [t.captureId, t.partId] })],
);

/**
 * What has been noticed by e-mail, so nothing is noticed twice: each failing measured pulse or capture (one e-mail
 * per paste, upload or bench post lists them all), and each change of a standing decision's drift. A row here means
 * the e-mail is in the outbox, written in the same transaction.
 */
export const notices = pgTable(
  "notices",
  {
    ...rowId,
    ...inWorkspace,
    subjectType: text().notNull(),
    subjectId: uuid().notNull(),
    /**
     * Which state of the subject was noticed: empty for a failing pulse (noticed once, ever); for a drifting
     * decision, a hash of the verdicts that changed, so each change is noticed once and an unchanged drift never again.
     */
    fingerprint: text().notNull().default(""),
    recipientId: uuid().references(() => users.id, { onDelete: "set null" }),
    ...created,
  },
  (t) => [uniqueIndex("notices_subject_fingerprint_idx").on(t.subjectType, t.subjectId, t.fingerprint)],
);

/**
 * Every e-mail the app sends, written in the transaction that decides to send it and delivered by the outbox worker
 * (src/lib/mail/outbox.ts), retried with backoff while the mail server is down. A row is marked sent only after the
 * server accepted it; its body is then cleared (it may hold a single-use link). Admins see the workspace's rows.
 */
export const mailOutbox = pgTable(
  "mail_outbox",
  {
    ...rowId,
    workspaceId: uuid().references(() => workspaces.id, { onDelete: "cascade" }),
    kind: text().notNull(),
    to: text().notNull(),
    subject: text().notNull(),
    text: text().notNull(),
    html: text(),
    status: text({ enum: ["pending", "sent"] })
      .notNull()
      .default("pending"),
    attempts: integer().notNull().default(0),
    nextAttemptAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
    lastError: text(),
    sentAt: timestamp({ withTimezone: true }),
    ...created,
  },
  (t) => [index().on(t.status, t.nextAttemptAt), index().on(t.workspaceId, t.createdAt)],
);

// Decisions ---------------------------------------------------------------------------------------------------

/**
 * A lead's signed choice of a candidate for a project, with a frozen snapshot of everything the choice rested on
 * (parts and curve-set versions, policy and temperature, every pulse and result). Never edited: a new decision
 * supersedes the previous one.
 */
export const decisions = pgTable(
  "decisions",
  {
    ...rowId,
    ...inWorkspace,
    ...inProject,
    chosenPartId: uuid().references(() => parts.id, { onDelete: "set null" }),
    chosenLabel: text().notNull(),
    rationale: text().notNull(),
    snapshot: jsonb().$type<DecisionSnapshot>().notNull(),
    signedBy: uuid().references(() => users.id, { onDelete: "set null" }),
    signedByName: text().notNull(),
    signedAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
    supersededBy: uuid(),
    supersededAt: timestamp({ withTimezone: true }),
    /** Sent by the form once per decision it signs: a repeated submission answers 409 instead of a second row. */
    idempotencyKey: text(),
  },
  (t) => [
    index().on(t.projectId, t.signedAt),
    // One standing decision per project, by constraint: parallel signatures cannot leave two.
    uniqueIndex("decisions_one_standing_per_project").on(t.projectId).where(sql`${t.supersededBy} is null`),
    uniqueIndex().on(t.projectId, t.idempotencyKey),
  ],
);

// Relations -------------------------------------------------------------------------------------------------

export const membershipsRelations = relations(memberships, ({ one }) => ({
  user: one(users, { fields: [memberships.userId], references: [users.id] }),
  workspace: one(workspaces, { fields: [memberships.workspaceId], references: [workspaces.id] }),
}));

// Types -----------------------------------------------------------------------------------------------------

export type Workspace = typeof workspaces.$inferSelect;
export type NewWorkspace = typeof workspaces.$inferInsert;
export type User = typeof users.$inferSelect;
export type Membership = typeof memberships.$inferSelect;
export type Role = (typeof roleEnum.enumValues)[number];
export type Invitation = typeof invitations.$inferSelect;
export type ApiToken = typeof apiTokens.$inferSelect;
export type AuditEvent = typeof auditEvents.$inferSelect;
export type Part = typeof parts.$inferSelect;
export type NewPart = typeof parts.$inferInsert;
export type Technology = (typeof technologyEnum.enumValues)[number];
export type CurveSetRow = typeof curveSets.$inferSelect;
export type CurveRow = typeof curves.$inferSelect;
export type Project = typeof projects.$inferSelect;
export type FaultCase = typeof faultCases.$inferSelect;
export type MeasuredPulse = typeof measuredPulses.$inferSelect;
export type Capture = typeof captures.$inferSelect;
export type CaptureStatus = (typeof captureStatusEnum.enumValues)[number];
export type CaptureResultRow = typeof captureResults.$inferSelect;
export type Decision = typeof decisions.$inferSelect;
export type OutboxMail = typeof mailOutbox.$inferSelect;
