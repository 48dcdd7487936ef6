/**
 * The local stand-ins for the outside services (an S3-compatible store and an SMTP server),
 * for `npm start` and tests when no real ones are configured. They serve every Rillmark
 * process on the machine, each with credentials made at start, so nobody else on the machine
 * can read the stored files or write into the Outbox. The app processes are then configured
 * exactly as for real services (S3_ENDPOINT, SMTP_HOST, … ; see standInSettings).
 */
import { randomBytes } from "node:crypto";
import type { Config } from "./config";
import type { Db } from "./db/client";
import { startFakeSmtp, type SmtpCredentials } from "./mail/fake-smtp";
import { startFakeS3 } from "./storage/fake-s3";
import type { S3Credentials } from "./storage/s3-signature";

export interface StandInCredentials {
  s3: S3Credentials;
  smtp: SmtpCredentials;
}

export interface StandInOptions {
  db: Db;
  /** Where the S3 stand-in keeps its objects. */
  s3Dir: string;
  bucket: string;
  s3Port: number;
  smtpPort: number;
  credentials: StandInCredentials;
}

export interface RunningStandIns {
  s3Endpoint: string;
  smtpPort: number;
  close(): Promise<void>;
}

const secret = (bytes: number) => randomBytes(bytes).toString("base64url");

/** Fresh random credentials (the stand-ins keep nothing that needs the old ones). */
export function newStandInCredentials(): StandInCredentials {
  return {
    s3: { accessKeyId: `RILLMARK${secret(9).toUpperCase()}`, secretAccessKey: secret(30) },
    smtp: { user: "rillmark", pass: secret(24) },
  };
}

export async function startStandIns(options: StandInOptions): Promise<RunningStandIns> {
  const { credentials } = options;
  const s3 = await startFakeS3(options.s3Dir, options.bucket, credentials.s3, options.s3Port);
  try {
    const smtp = await startFakeSmtp(options.db, credentials.smtp, options.smtpPort);
    return {
      s3Endpoint: s3.endpoint,
      smtpPort: smtp.port,
      async close() {
        await smtp.close();
        await s3.close();
      },
    };
  } catch (err) {
    await s3.close();
    throw err;
  }
}

type StandInAddress = Pick<RunningStandIns, "s3Endpoint" | "smtpPort">;

/** True when the config names no object store or no mail server (stand-ins then serve). */
export function needsStandIns(config: Config): boolean {
  return !config.storage.endpoint || !config.smtp.host;
}

/** The config pointed at running stand-ins, for whichever service it does not name itself. */
export function withStandIns(
  config: Config,
  running: StandInAddress,
  credentials: StandInCredentials,
): Config {
  return {
    ...config,
    storage: config.storage.endpoint
      ? config.storage
      : {
          ...config.storage,
          endpoint: running.s3Endpoint,
          ...credentials.s3,
          forcePathStyle: true,
        },
    smtp: config.smtp.host
      ? config.smtp
      : {
          host: "127.0.0.1",
          port: running.smtpPort,
          secure: false,
          user: credentials.smtp.user,
          pass: credentials.smtp.pass,
        },
  };
}

/** The same, as the environment settings of a child process (which parses its own config). */
export function standInSettings(
  config: Config,
  running: StandInAddress,
  credentials: StandInCredentials,
): Record<string, string> {
  const none: Record<string, string> = {};
  const s3: Record<string, string> = config.storage.endpoint
    ? none
    : {
        S3_ENDPOINT: running.s3Endpoint,
        S3_ACCESS_KEY_ID: credentials.s3.accessKeyId,
        S3_SECRET_ACCESS_KEY: credentials.s3.secretAccessKey,
        S3_FORCE_PATH_STYLE: "true",
      };
  const smtp: Record<string, string> = config.smtp.host
    ? none
    : {
        SMTP_HOST: "127.0.0.1",
        SMTP_PORT: String(running.smtpPort),
        SMTP_SECURE: "false",
        SMTP_USER: credentials.smtp.user,
        SMTP_PASS: credentials.smtp.pass,
      };
  return { ...s3, ...smtp };
}
