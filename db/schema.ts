// The database schema: better-auth's four tables (written by hand from its documented model), then Phasewright's own.
import { relations, sql } from 'drizzle-orm';
import {
  bigint,
  bigserial,
  boolean,
  customType,
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

const createdAt = () => timestamp('created_at', { withTimezone: true }).notNull().defaultNow();
const updatedAt = () =>
  timestamp('updated_at', { withTimezone: true })
    .notNull()
    .defaultNow()
    .$onUpdate(() => new Date());

// better-auth: user, session, account, verification. Column names are snake_case; the adapter maps by property name.
export const user = pgTable('user', {
  id: text('id').primaryKey(),
  name: text('name').notNull(),
  email: text('email').notNull().unique(),
  emailVerified: boolean('email_verified').notNull().default(false),
  image: text('image'),
  // better-auth's anonymous plugin: guests who opened a viewer link and gave a name to comment.
  isAnonymous: boolean('is_anonymous').notNull().default(false),
  createdAt: createdAt(),
  updatedAt: updatedAt(),
});

export const session = pgTable(
  'session',
  {
    id: text('id').primaryKey(),
    expiresAt: timestamp('expires_at', { withTimezone: true }).notNull(),
    token: text('token').notNull().unique(),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
    ipAddress: text('ip_address'),
    userAgent: text('user_agent'),
    userId: text('user_id')
      .notNull()
      .references(() => user.id, { onDelete: 'cascade' }),
  },
  (t) => [index('session_user_idx').on(t.userId)],
);

export const account = pgTable(
  'account',
  {
    id: text('id').primaryKey(),
    accountId: text('account_id').notNull(),
    providerId: text('provider_id').notNull(),
    userId: text('user_id')
      .notNull()
      .references(() => user.id, { onDelete: 'cascade' }),
    accessToken: text('access_token'),
    refreshToken: text('refresh_token'),
    idToken: text('id_token'),
    accessTokenExpiresAt: timestamp('access_token_expires_at', { withTimezone: true }),
    refreshTokenExpiresAt: timestamp('refresh_token_expires_at', { withTimezone: true }),
    scope: text('scope'),
    password: text('password'),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [index('account_user_idx').on(t.userId)],
);

export const verification = pgTable(
  'verification',
  {
    id: text('id').primaryKey(),
    identifier: text('identifier').notNull(),
    value: text('value').notNull(),
    expiresAt: timestamp('expires_at', { withTimezone: true }).notNull(),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [index('verification_identifier_idx').on(t.identifier)],
);

// Phasewright.
export const roleEnum = pgEnum('project_role', ['owner', 'editor', 'viewer']);

export const project = pgTable('project', {
  id: uuid('id').primaryKey().default(sql`gen_random_uuid()`),
  name: text('name').notNull(),
  description: text('description').notNull().default(''),
  createdBy: text('created_by').references(() => user.id, { onDelete: 'set null' }),
  createdAt: createdAt(),
  updatedAt: updatedAt(),
});

export const projectMember = pgTable(
  'project_member',
  {
    projectId: uuid('project_id')
      .notNull()
      .references(() => project.id, { onDelete: 'cascade' }),
    userId: text('user_id')
      .notNull()
      .references(() => user.id, { onDelete: 'cascade' }),
    role: roleEnum('role').notNull(),
    createdAt: createdAt(),
  },
  (t) => [primaryKey({ columns: [t.projectId, t.userId] }), index('project_member_user_idx').on(t.userId)],
);

export const sheet = pgTable(
  'sheet',
  {
    id: uuid('id').primaryKey().default(sql`gen_random_uuid()`),
    projectId: uuid('project_id')
      .notNull()
      .references(() => project.id, { onDelete: 'cascade' }),
    name: text('name').notNull(),
    createdBy: text('created_by').references(() => user.id, { onDelete: 'set null' }),
    updatedBy: text('updated_by').references(() => user.id, { onDelete: 'set null' }),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [index('sheet_project_idx').on(t.projectId)],
);

// Messages caught by the local SMTP sink (only used when no SMTP_URL is configured).
export const mailMessage = pgTable('mail_message', {
  id: uuid('id').primaryKey().default(sql`gen_random_uuid()`),
  fromAddress: text('from_address').notNull(),
  toAddresses: text('to_addresses').array().notNull(),
  subject: text('subject').notNull(),
  textBody: text('text_body').notNull(),
  htmlBody: text('html_body'),
  receivedAt: timestamp('received_at', { withTimezone: true }).notNull().defaultNow(),
});

export const projectRelations = relations(project, ({ many }) => ({
  members: many(projectMember),
  sheets: many(sheet),
}));
export const projectMemberRelations = relations(projectMember, ({ one }) => ({
  project: one(project, { fields: [projectMember.projectId], references: [project.id] }),
  user: one(user, { fields: [projectMember.userId], references: [user.id] }),
}));
export const sheetRelations = relations(sheet, ({ one }) => ({
  project: one(project, { fields: [sheet.projectId], references: [project.id] }),
}));

// A sheet's collaborative document: the latest snapshot (a Yjs state) and the updates written after it, in order.
// Every update is stored before the server relays it, so a crash loses nothing any client was shown.
const bytea = customType<{ data: Uint8Array; driverData: Uint8Array }>({
  dataType: () => 'bytea',
  fromDriver: (value) => new Uint8Array(value),
  toDriver: (value) => value,
});

export const sheetSnapshot = pgTable('sheet_snapshot', {
  sheetId: uuid('sheet_id')
    .primaryKey()
    .references(() => sheet.id, { onDelete: 'cascade' }),
  state: bytea('state').notNull(),
  // The last update sequence number folded into this snapshot.
  throughSeq: bigint('through_seq', { mode: 'number' }).notNull(),
  updatedAt: updatedAt(),
});

export const sheetUpdate = pgTable(
  'sheet_update',
  {
    seq: bigserial('seq', { mode: 'number' }).primaryKey(),
    sheetId: uuid('sheet_id')
      .notNull()
      .references(() => sheet.id, { onDelete: 'cascade' }),
    update: bytea('update').notNull(),
    userId: text('user_id'),
    createdAt: createdAt(),
  },
  (t) => [index('sheet_update_sheet_seq_idx').on(t.sheetId, t.seq)],
);

// Invitations to a project, sent by e-mail. The token is stored only as a hash; it works once and expires.
export const invitation = pgTable(
  'invitation',
  {
    id: uuid('id').primaryKey().default(sql`gen_random_uuid()`),
    projectId: uuid('project_id')
      .notNull()
      .references(() => project.id, { onDelete: 'cascade' }),
    email: text('email').notNull(),
    role: roleEnum('role').notNull(),
    tokenHash: text('token_hash').notNull().unique(),
    invitedBy: text('invited_by').references(() => user.id, { onDelete: 'set null' }),
    createdAt: createdAt(),
    sentAt: timestamp('sent_at', { withTimezone: true }).notNull().defaultNow(),
    expiresAt: timestamp('expires_at', { withTimezone: true }).notNull(),
    acceptedAt: timestamp('accepted_at', { withTimezone: true }),
    acceptedBy: text('accepted_by').references(() => user.id, { onDelete: 'set null' }),
    withdrawnAt: timestamp('withdrawn_at', { withTimezone: true }),
  },
  (t) => [index('invitation_project_idx').on(t.projectId)],
);

// Who changed which membership, when: shown to owners as the project's activity.
export const membershipEvent = pgTable(
  'membership_event',
  {
    id: uuid('id').primaryKey().default(sql`gen_random_uuid()`),
    projectId: uuid('project_id')
      .notNull()
      .references(() => project.id, { onDelete: 'cascade' }),
    actorId: text('actor_id').references(() => user.id, { onDelete: 'set null' }),
    action: text('action').notNull(),
    subject: text('subject').notNull(),
    role: roleEnum('role'),
    createdAt: createdAt(),
  },
  (t) => [index('membership_event_project_idx').on(t.projectId, t.createdAt)],
);

// Read-only links to one sheet. The token is long and random and stored only as a hash.
export const viewerLink = pgTable(
  'viewer_link',
  {
    id: uuid('id').primaryKey().default(sql`gen_random_uuid()`),
    sheetId: uuid('sheet_id')
      .notNull()
      .references(() => sheet.id, { onDelete: 'cascade' }),
    tokenHash: text('token_hash').notNull().unique(),
    label: text('label').notNull().default(''),
    createdBy: text('created_by').references(() => user.id, { onDelete: 'set null' }),
    createdAt: createdAt(),
    expiresAt: timestamp('expires_at', { withTimezone: true }),
    revokedAt: timestamp('revoked_at', { withTimezone: true }),
  },
  (t) => [index('viewer_link_sheet_idx').on(t.sheetId)],
);

// Pins: comments anchored to an element or a point of a sheet, numbered per sheet, with replies and attachments.
export const pin = pgTable(
  'pin',
  {
    id: uuid('id').primaryKey().default(sql`gen_random_uuid()`),
    sheetId: uuid('sheet_id')
      .notNull()
      .references(() => sheet.id, { onDelete: 'cascade' }),
    number: integer('number').notNull(),
    elementId: text('element_id'),
    x: doublePrecision('x').notNull().default(0),
    y: doublePrecision('y').notNull().default(0),
    authorId: text('author_id').references(() => user.id, { onDelete: 'set null' }),
    body: text('body').notNull(),
    createdAt: createdAt(),
    resolvedAt: timestamp('resolved_at', { withTimezone: true }),
    resolvedBy: text('resolved_by').references(() => user.id, { onDelete: 'set null' }),
  },
  (t) => [uniqueIndex('pin_sheet_number_idx').on(t.sheetId, t.number)],
);

export const pinReply = pgTable(
  'pin_reply',
  {
    id: uuid('id').primaryKey().default(sql`gen_random_uuid()`),
    pinId: uuid('pin_id')
      .notNull()
      .references(() => pin.id, { onDelete: 'cascade' }),
    authorId: text('author_id').references(() => user.id, { onDelete: 'set null' }),
    body: text('body').notNull(),
    createdAt: createdAt(),
  },
  (t) => [index('pin_reply_pin_idx').on(t.pinId, t.createdAt)],
);

export const pinAttachment = pgTable(
  'pin_attachment',
  {
    id: uuid('id').primaryKey().default(sql`gen_random_uuid()`),
    pinId: uuid('pin_id')
      .notNull()
      .references(() => pin.id, { onDelete: 'cascade' }),
    uploadedBy: text('uploaded_by').references(() => user.id, { onDelete: 'set null' }),
    fileName: text('file_name').notNull(),
    mediaType: text('media_type').notNull(),
    sizeBytes: integer('size_bytes').notNull(),
    content: bytea('content').notNull(),
    createdAt: createdAt(),
  },
  (t) => [index('pin_attachment_pin_idx').on(t.pinId)],
);

// Per-person choices, such as whether pin e-mails are wanted.
export const userPreference = pgTable('user_preference', {
  userId: text('user_id')
    .primaryKey()
    .references(() => user.id, { onDelete: 'cascade' }),
  pinEmails: boolean('pin_emails').notNull().default(true),
  updatedAt: updatedAt(),
});

// Revisions: a sheet's document frozen when issued, numbered per sheet, with what the solver made of it then.
// Rows are written once and never updated: a later edit of the sheet cannot change an issued revision.
export const revision = pgTable(
  'revision',
  {
    id: uuid('id').primaryKey().default(sql`gen_random_uuid()`),
    sheetId: uuid('sheet_id')
      .notNull()
      .references(() => sheet.id, { onDelete: 'cascade' }),
    number: integer('number').notNull(),
    note: text('note').notNull().default(''),
    // The room's document as a Yjs state, and its JSON view (the sheet format) at the moment of issue.
    state: bytea('state').notNull(),
    document: jsonb('document').notNull(),
    // SHA-256 (hex) of the canonical JSON of the document: the solver's input.
    inputHash: text('input_hash').notNull(),
    solverVersion: text('solver_version').notNull(),
    // The base case and each what-if as the solver returned them (see server/revisions/study.ts), and each case in
    // a few figures for lists (so listing revisions never reads the full results).
    results: jsonb('results').notNull(),
    cases: jsonb('cases').notNull().default([]),
    issuedBy: text('issued_by').references(() => user.id, { onDelete: 'set null' }),
    issuedByName: text('issued_by_name').notNull().default(''),
    issuedAt: timestamp('issued_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex('revision_sheet_number_idx').on(t.sheetId, t.number)],
);

export const reviewVerdictEnum = pgEnum('review_verdict', ['reviewed', 'approved']);

// Marks on a revision by a member or by someone holding a viewer link (a guest gives a name).
export const revisionReview = pgTable(
  'revision_review',
  {
    id: uuid('id').primaryKey().default(sql`gen_random_uuid()`),
    revisionId: uuid('revision_id')
      .notNull()
      .references(() => revision.id, { onDelete: 'cascade' }),
    reviewerId: text('reviewer_id').references(() => user.id, { onDelete: 'set null' }),
    reviewerName: text('reviewer_name').notNull(),
    verdict: reviewVerdictEnum('verdict').notNull(),
    comment: text('comment').notNull().default(''),
    viaLink: boolean('via_link').notNull().default(false),
    createdAt: createdAt(),
  },
  (t) => [index('revision_review_revision_idx').on(t.revisionId, t.createdAt)],
);
