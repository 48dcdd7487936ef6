import { sql } from "drizzle-orm";
import {
  bigint,
  boolean,
  check,
  index,
  integer,
  json,
  pgEnum,
  pgTable,
  text,
  timestamp,
  unique,
  uuid,
  varchar,
} from "drizzle-orm/pg-core";
import { ROLES } from "../../shared/roles";
import { UNIT_SYSTEMS } from "../../shared/schemas/projects";

const id = () => uuid("id").primaryKey().defaultRandom();
const at = (name: string) => timestamp(name, { withTimezone: true });
const createdAt = () => at("created_at").notNull().defaultNow();

export const roleEnum = pgEnum("member_role", ROLES);
export const unitSystemEnum = pgEnum("unit_system", UNIT_SYSTEMS);

export const teams = pgTable("teams", {
  id: id(),
  name: text("name").notNull(),
  createdAt: createdAt(),
});

export const users = pgTable(
  "users",
  {
    id: id(),
    email: text("email").notNull().unique(),
    name: text("name").notNull(),
    passwordHash: text("password_hash").notNull(),
    createdAt: createdAt(),
  },
  // The API lower-cases e-mails; the constraint keeps a stray write from making duplicates.
  (t) => [check("users_email_lower_case", sql`${t.email} = lower(${t.email})`)],
);

export const memberships = pgTable(
  "memberships",
  {
    id: id(),
    teamId: uuid("team_id")
      .notNull()
      .references(() => teams.id, { onDelete: "cascade" }),
    userId: uuid("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    role: roleEnum("role").notNull(),
    createdAt: createdAt(),
  },
  (t) => [unique("memberships_team_user").on(t.teamId, t.userId), index().on(t.userId)],
);

export const invitations = pgTable(
  "invitations",
  {
    id: id(),
    teamId: uuid("team_id")
      .notNull()
      .references(() => teams.id, { onDelete: "cascade" }),
    email: text("email").notNull(),
    role: roleEnum("role").notNull(),
    tokenHash: text("token_hash").notNull().unique(),
    invitedBy: uuid("invited_by").references(() => users.id, { onDelete: "set null" }),
    createdAt: createdAt(),
    expiresAt: at("expires_at").notNull(),
    acceptedAt: at("accepted_at"),
    revokedAt: at("revoked_at"),
  },
  (t) => [index().on(t.teamId), index().on(t.email)],
);

export const passwordResets = pgTable(
  "password_resets",
  {
    id: id(),
    userId: uuid("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    tokenHash: text("token_hash").notNull().unique(),
    createdAt: createdAt(),
    expiresAt: at("expires_at").notNull(),
    usedAt: at("used_at"),
  },
  (t) => [index().on(t.userId)],
);

/** Pending sign-ups: nothing is created until the address is confirmed. */
export const emailConfirmations = pgTable("email_confirmations", {
  id: id(),
  email: text("email").notNull(),
  name: text("name").notNull(),
  passwordHash: text("password_hash").notNull(),
  teamName: text("team_name").notNull(),
  tokenHash: text("token_hash").notNull().unique(),
  createdAt: createdAt(),
  expiresAt: at("expires_at").notNull(),
  usedAt: at("used_at"),
});

export const projects = pgTable(
  "projects",
  {
    id: id(),
    teamId: uuid("team_id")
      .notNull()
      .references(() => teams.id, { onDelete: "cascade" }),
    name: text("name").notNull(),
    description: text("description").notNull().default(""),
    units: unitSystemEnum("units").notNull(),
    designReturnPeriodYears: integer("design_return_period_years").notNull(),
    isDemo: boolean("is_demo").notNull().default(false),
    createdBy: uuid("created_by").references(() => users.id, { onDelete: "set null" }),
    createdAt: createdAt(),
    updatedAt: at("updated_at")
      .notNull()
      .defaultNow()
      .$onUpdate(() => new Date()),
  },
  (t) => [
    index().on(t.teamId),
    check("projects_return_period_positive", sql`${t.designReturnPeriodYears} > 0`),
  ],
);

/**
 * Mail caught by the local fake SMTP server (development and tests only). `teamId` is the team a
 * message was sent for (invitations); personal mail (resets, confirmations) has none and is
 * shown only to its recipient.
 */
export const outboxMessages = pgTable(
  "outbox_messages",
  {
    id: id(),
    teamId: uuid("team_id").references(() => teams.id, { onDelete: "set null" }),
    to: text("to").notNull(),
    from: text("from").notNull(),
    subject: text("subject").notNull(),
    text: text("text").notNull(),
    html: text("html"),
    raw: text("raw").notNull(),
    receivedAt: at("received_at").notNull().defaultNow(),
  },
  (t) => [index().on(t.to), index().on(t.receivedAt), index().on(t.teamId)],
);

/** One row per seed that has run, so a seed never runs twice and never overwrites edits. */
export const seedRuns = pgTable("seed_runs", {
  name: text("name").primaryKey(),
  ranAt: at("ran_at").notNull().defaultNow(),
});

/**
 * rate-limiter-flexible's Postgres store (server/auth/rate-limits.ts), owned by our migrations
 * like the sessions table: counters every app process shares and a restart keeps. Its columns
 * are the store's own (expire in epoch milliseconds); keys carry no e-mail in clear.
 */
export const rateLimits = pgTable(
  "rate_limits",
  {
    key: varchar("key", { length: 255 }).primaryKey(),
    points: integer("points").notNull().default(0),
    expire: bigint("expire", { mode: "number" }),
  },
  (t) => [index("rate_limits_expire_idx").on(t.expire)],
);

/** connect-pg-simple's table, owned by our migrations (the store must not create it). */
export const userSessions = pgTable(
  "user_sessions",
  {
    sid: varchar("sid").primaryKey(),
    sess: json("sess").notNull(),
    expire: timestamp("expire", { precision: 6 }).notNull(),
  },
  (t) => [
    index("user_sessions_expire_idx").on(t.expire),
    // Password changes and resets sign a user out everywhere: find their sessions quickly.
    index("user_sessions_user_id_idx").on(sql`(${t.sess}->>'userId')`),
  ],
);
