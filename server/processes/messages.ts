import type { StandInCredentials } from "../standins";

/** The roles a Rillmark process can have (server/processes/entry.ts starts one). */
export const ROLES = ["web", "worker", "standins"] as const;
export type ProcessRole = (typeof ROLES)[number];

/** Supervisor → child. */
export type ToChild =
  | { type: "start-standins"; credentials: StandInCredentials; s3Port: number; smtpPort: number }
  | { type: "stop" };

/** Child → supervisor. */
export type FromChild =
  | { type: "ready"; port?: number; s3Endpoint?: string; smtpPort?: number }
  | { type: "failed"; message: string };
