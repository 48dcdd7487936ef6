import os from "node:os";
import path from "node:path";
import { z } from "zod";
import type { PublicConfig } from "../shared/schemas/auth";

/** The development secret. Fine on a laptop; production refuses to start with it. */
export const DEFAULT_SESSION_SECRET = "rillmark-local-development-secret-change-me";

const flag = (fallback: boolean) =>
  z
    .enum(["true", "false", "1", "0", "yes", "no", "on", "off"], {
      message: "Use true or false.",
    })
    .optional()
    .transform((v) => (v === undefined ? fallback : ["true", "1", "yes", "on"].includes(v)));

const port = (fallback: number) =>
  z.coerce
    .number({ message: "Use a port number." })
    .int({ message: "Use a whole number." })
    .min(0, { message: "Use 0 to 65535." })
    .max(65535, { message: "Use 0 to 65535." })
    .default(fallback);

const count = (fallback: number) =>
  z.coerce
    .number({ message: "Use a whole number." })
    .int({ message: "Use a whole number." })
    .min(1, { message: "Use at least 1." })
    .default(fallback);

const optionalText = z
  .string()
  .optional()
  .transform((v) => (v === undefined || v.trim() === "" ? undefined : v.trim()));

const envSchema = z.object({
  NODE_ENV: z.enum(["development", "production", "test"]).default("development"),
  PORT: port(5180),
  /** App (HTTP) processes under `npm start`; the worker and the stand-ins are one each. */
  WEB_CONCURRENCY: z.coerce
    .number({ message: "Use a whole number." })
    .int({ message: "Use a whole number." })
    .min(1, { message: "Use at least 1." })
    .max(64, { message: "Use at most 64." })
    .optional(),
  HOST: z.string().min(1).default("127.0.0.1"),
  DATABASE_URL: z
    .string({ message: "Set DATABASE_URL (npm start sets it for the local database)." })
    .regex(/^postgres(ql)?:\/\//, { message: "Use a postgres:// connection URL." }),
  DATABASE_STATEMENT_TIMEOUT_SECONDS: z.coerce.number().min(0.1).max(3600).default(15),
  DATABASE_JOB_STATEMENT_TIMEOUT_SECONDS: z.coerce.number().min(1).max(86_400).default(600),
  SESSION_SECRET: z.string().min(1).default(DEFAULT_SESSION_SECRET),
  PUBLIC_BASE_URL: optionalText.pipe(
    z.url({ protocol: /^https?$/, message: "Use an http:// or https:// URL." }).optional(),
  ),
  TRUST_PROXY: flag(false),
  SIGNUP_ENABLED: flag(true),
  SMTP_HOST: optionalText,
  SMTP_PORT: port(587),
  SMTP_SECURE: flag(false),
  SMTP_USER: optionalText,
  SMTP_PASS: optionalText,
  MAIL_FROM: z.string().min(3).default("Rillmark <no-reply@rillmark.localhost>"),
  FAKE_SMTP_PORT: port(0),
  CLIENT_DIST: z.string().min(1).default("dist/client"),
  RATE_LIMIT_WINDOW_MINUTES: count(15),
  SIGN_IN_LIMIT_PER_ACCOUNT: count(10),
  SIGN_IN_LIMIT_PER_IP: count(50),
  SIGN_IN_LOCK_SECONDS: count(60),
  EMAIL_LIMIT_PER_IP: count(20),
  EMAIL_LIMIT_PER_ADDRESS: count(5),
  SESSION_MAX_AGE_HOURS: count(24 * 14),
  S3_ENDPOINT: optionalText.pipe(
    z.url({ protocol: /^https?$/, message: "Use an http:// or https:// URL." }).optional(),
  ),
  S3_BUCKET: z.string().min(3).default("rillmark"),
  S3_REGION: z.string().min(1).default("us-east-1"),
  S3_ACCESS_KEY_ID: optionalText,
  S3_SECRET_ACCESS_KEY: optionalText,
  S3_FORCE_PATH_STYLE: flag(true),
  FAKE_S3_PORT: port(0),
  FAKE_S3_DIR: z.string().min(1).default(".data/s3"),
  STORAGE_CACHE_DIR: z.string().min(1).default(".data/cache"),
  UPLOAD_DIR: optionalText,
  UPLOAD_LIMIT_VECTOR_MB: count(200),
  UPLOAD_LIMIT_TERRAIN_MB: count(1024),
  UPLOAD_LIMIT_RAINFALL_KB: count(1024),
  UPLOAD_WAIT_MS: z.coerce.number().int().min(0).max(60_000).default(5000),
  JOB_QUEUE_SUFFIX: optionalText,
  BASEMAP_STYLE_URL: optionalText.pipe(
    z.url({ protocol: /^https?$/, message: "Use an http:// or https:// URL." }).optional(),
  ),
  BASEMAP_PMTILES_PATH: optionalText,
});

/** Every environment variable Rillmark reads (.env.example documents each one). */
export const ENV_VARIABLES = Object.keys(envSchema.shape);

export interface Config {
  nodeEnv: "development" | "production" | "test";
  port: number;
  host: string;
  /** How many app processes `npm start` runs (default: one per core). */
  webProcesses: number;
  databaseUrl: string;
  /** The longest one SQL statement may run: for requests (then 503), and for background jobs. */
  statementTimeoutMs: { request: number; job: number };
  sessionSecret: string;
  /** Undefined means "the address the server listens on" (resolved once it listens). */
  publicBaseUrl: string | undefined;
  trustProxy: boolean;
  signUpEnabled: boolean;
  smtp: {
    host: string | undefined;
    port: number;
    secure: boolean;
    user: string | undefined;
    pass: string | undefined;
  };
  mailFrom: string;
  fakeSmtpPort: number;
  clientDist: string;
  outboxEnabled: boolean;
  rateLimits: RateLimitConfig;
  sessionMaxAgeMs: number;
  storage: StorageConfig;
  uploads: UploadConfig;
  /** What the map draws under project layers (demo basemap unless an admin configures one). */
  basemap: BasemapConfig;
  /** Queue names get this suffix (tests: one per app, so apps sharing a database never swap jobs). */
  jobQueueSuffix: string;
}

export interface RateLimitConfig {
  windowMs: number;
  signInPerAccount: number;
  signInPerIp: number;
  /** How long an account that ran out of attempts waits between attempts from new devices. */
  signInLockMs: number;
  emailPerIp: number;
  emailPerAddress: number;
  /** Starts every counter's key: apps sharing a database share counters only with one prefix. */
  keyPrefix: string;
  /** Delete long-expired counters every few minutes (off in tests: many short-lived apps). */
  pruneExpired: boolean;
}

export interface StorageConfig {
  /** A real S3-compatible endpoint; undefined starts the local stand-in on 127.0.0.1. */
  endpoint: string | undefined;
  bucket: string;
  region: string;
  accessKeyId: string | undefined;
  secretAccessKey: string | undefined;
  forcePathStyle: boolean;
  fakePort: number;
  fakeDir: string;
  /** Local copies of stored objects (terrain read by windows needs a seekable file). */
  cacheDir: string;
}

export interface UploadConfig {
  /** Where multer streams uploads before they are checked and stored. */
  dir: string;
  limitsBytes: { vector: number; terrain: number; rainfall: number };
  /** How long an upload request waits for its ingest job before answering 202. */
  waitMs: number;
}

/**
 * The map's basemap: the invented demo area's tiles (default), an admin's own style on their
 * network, or a local PMTiles archive the app serves at BASEMAP_ARCHIVE_PATH with range requests.
 */
export type BasemapConfig =
  { kind: "demo" } | { kind: "style"; url: string } | { kind: "pmtiles"; path: string };

/** Where the app serves a configured PMTiles archive. */
export const BASEMAP_ARCHIVE_PATH = "/api/basemap/archive.pmtiles";

/** A config whose public address is known; what the HTTP app needs. */
export type AppConfig = Config & { publicBaseUrl: string };

export class ConfigError extends Error {
  override name = "ConfigError";
}

/** An address on this machine (the local stand-ins live there). */
export function isLoopbackHost(host: string): boolean {
  return host === "localhost" || host === "::1" || /^127(\.\d{1,3}){3}$/.test(host);
}

/** Parse the environment once at boot. Throws ConfigError with every problem listed. */
export function loadConfig(env: NodeJS.ProcessEnv = process.env): Config {
  const parsed = envSchema.safeParse(env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join(".")}: ${i.message}`);
    throw new ConfigError(`Rillmark cannot start; fix these settings:\n${lines.join("\n")}`);
  }
  const e = parsed.data;
  if (e.BASEMAP_STYLE_URL && e.BASEMAP_PMTILES_PATH) {
    throw new ConfigError(
      "Rillmark cannot start: set BASEMAP_STYLE_URL or BASEMAP_PMTILES_PATH, not both.",
    );
  }
  const config: Config = {
    nodeEnv: e.NODE_ENV,
    port: e.PORT,
    host: e.HOST,
    webProcesses: e.WEB_CONCURRENCY ?? os.availableParallelism(),
    databaseUrl: e.DATABASE_URL,
    statementTimeoutMs: {
      request: Math.round(e.DATABASE_STATEMENT_TIMEOUT_SECONDS * 1000),
      job: Math.round(e.DATABASE_JOB_STATEMENT_TIMEOUT_SECONDS * 1000),
    },
    sessionSecret: e.SESSION_SECRET,
    publicBaseUrl: e.PUBLIC_BASE_URL?.replace(/\/+$/, ""),
    trustProxy: e.TRUST_PROXY,
    signUpEnabled: e.SIGNUP_ENABLED,
    smtp: {
      host: e.SMTP_HOST,
      port: e.SMTP_PORT,
      secure: e.SMTP_SECURE,
      user: e.SMTP_USER,
      pass: e.SMTP_PASS,
    },
    mailFrom: e.MAIL_FROM,
    fakeSmtpPort: e.FAKE_SMTP_PORT,
    clientDist: e.CLIENT_DIST,
    // Only while mail goes to the local stand-in (no SMTP_HOST, or the address npm start gives
    // its app processes, on this machine): a real mail service leaves nothing to show, and
    // production never shows stored mail.
    outboxEnabled: e.NODE_ENV !== "production" && (!e.SMTP_HOST || isLoopbackHost(e.SMTP_HOST)),
    rateLimits: {
      windowMs: e.RATE_LIMIT_WINDOW_MINUTES * 60_000,
      signInPerAccount: e.SIGN_IN_LIMIT_PER_ACCOUNT,
      signInPerIp: e.SIGN_IN_LIMIT_PER_IP,
      signInLockMs: e.SIGN_IN_LOCK_SECONDS * 1000,
      emailPerIp: e.EMAIL_LIMIT_PER_IP,
      emailPerAddress: e.EMAIL_LIMIT_PER_ADDRESS,
      keyPrefix: "",
      pruneExpired: true,
    },
    sessionMaxAgeMs: e.SESSION_MAX_AGE_HOURS * 3_600_000,
    storage: {
      endpoint: e.S3_ENDPOINT,
      bucket: e.S3_BUCKET,
      region: e.S3_REGION,
      accessKeyId: e.S3_ACCESS_KEY_ID,
      secretAccessKey: e.S3_SECRET_ACCESS_KEY,
      forcePathStyle: e.S3_FORCE_PATH_STYLE,
      fakePort: e.FAKE_S3_PORT,
      fakeDir: e.FAKE_S3_DIR,
      cacheDir: e.STORAGE_CACHE_DIR,
    },
    uploads: {
      dir: e.UPLOAD_DIR ?? path.join(os.tmpdir(), "rillmark-uploads"),
      limitsBytes: {
        vector: e.UPLOAD_LIMIT_VECTOR_MB * 1024 * 1024,
        terrain: e.UPLOAD_LIMIT_TERRAIN_MB * 1024 * 1024,
        rainfall: e.UPLOAD_LIMIT_RAINFALL_KB * 1024,
      },
      waitMs: e.UPLOAD_WAIT_MS,
    },
    basemap: e.BASEMAP_STYLE_URL
      ? { kind: "style", url: e.BASEMAP_STYLE_URL }
      : e.BASEMAP_PMTILES_PATH
        ? { kind: "pmtiles", path: path.resolve(e.BASEMAP_PMTILES_PATH) }
        : { kind: "demo" },
    jobQueueSuffix: e.JOB_QUEUE_SUFFIX ?? "",
  };
  assertSafeForProduction(config);
  return config;
}

/** Production must not run with guessable secrets or without a real mail server. */
export function assertSafeForProduction(config: Config): void {
  if (config.nodeEnv !== "production") return;
  if (config.sessionSecret === DEFAULT_SESSION_SECRET || config.sessionSecret.length < 32) {
    throw new ConfigError(
      "Rillmark refuses to start in production with the default or a short SESSION_SECRET. " +
        "Set SESSION_SECRET to a random value of at least 32 characters " +
        "(for example: node -e \"console.log(crypto.randomBytes(32).toString('base64url'))\").",
    );
  }
  if (!config.smtp.host) {
    throw new ConfigError(
      "Rillmark needs SMTP_HOST in production: invitations and password resets are e-mailed.",
    );
  }
  if (!config.storage.endpoint) {
    throw new ConfigError(
      "Rillmark needs S3_ENDPOINT (and S3_BUCKET, S3_ACCESS_KEY_ID, S3_SECRET_ACCESS_KEY) in " +
        "production: uploaded files are kept in object storage, not in the local fake.",
    );
  }
}

/** The address links in e-mails point at; derived from the listening address when not set. */
export function resolvePublicBaseUrl(config: Config, listeningPort: number): string {
  if (config.publicBaseUrl) return config.publicBaseUrl;
  const anyHost = config.host === "0.0.0.0" || config.host === "::";
  const host = anyHost ? "127.0.0.1" : config.host.includes(":") ? `[${config.host}]` : config.host;
  return `http://${host}:${listeningPort}`;
}

export function publicConfig(config: Config): PublicConfig {
  const { basemap } = config;
  return {
    signUpEnabled: config.signUpEnabled,
    outboxEnabled: config.outboxEnabled,
    // The archive's file path stays on the server; the client gets the URL that serves it.
    basemap: basemap.kind === "pmtiles" ? { kind: "pmtiles", url: BASEMAP_ARCHIVE_PATH } : basemap,
  };
}
