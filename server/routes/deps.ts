import type { Response } from "express";
import { logError } from "../log";
import type { RateLimiters } from "../auth/rate-limits";
import type { AppConfig } from "../config";
import type { Db } from "../db/client";
import type { JobQueue } from "../jobs/queue";
import type { Mailer } from "../mail/mailer";
import type { MailContent } from "../mail/templates";
import type { ObjectStore } from "../storage";

/** What every router is built from. */
export interface RouteDeps {
  db: Db;
  config: AppConfig;
  mailer: Mailer;
  limiters: RateLimiters;
  /** Uploaded originals and terrain files (localCopy() gives a seekable local file). */
  store: ObjectStore;
  /** Background jobs (pg-boss) and the news of layers they change. */
  jobs: JobQueue;
}

/**
 * Send without making the caller wait. Used where the answer must not depend on whether an
 * account exists (sign-up): both paths then answer in the same time.
 */
export function sendInBackground(mailer: Mailer, to: string, content: MailContent): void {
  mailer.send(to, content).catch((err: unknown) => {
    console.error(`Could not send "${content.subject}":`, err instanceof Error ? err.message : err);
  });
}

/**
 * Work that must not change the answer or its timing (a reset link for an address that may
 * have no account): runs once the answer has been sent; a failure is logged, not answered.
 */
export function afterAnswer(res: Response, work: () => Promise<void>): void {
  const run = () => {
    work().catch((err: unknown) => logError("Work after the answer failed:", err));
  };
  if (res.writableFinished) run();
  else res.once("finish", run);
}
