import nodemailer from "nodemailer";
import { isLoopbackHost, type Config } from "../config";
import type { MailContent } from "./templates";

/** The header naming the team a message is sent for; the local Outbox files mail by it. */
export const TEAM_HEADER = "X-Rillmark-Team";

export interface SendOptions {
  /** The team the message is sent for (an invitation); personal mail has none. */
  teamId?: string;
}

export interface Mailer {
  send(to: string, content: MailContent, options?: SendOptions): Promise<void>;
  /** Waits for messages still being sent (a reset link must not be lost on shutdown). */
  close(): Promise<void>;
}

export interface SmtpTarget {
  host: string;
  port: number;
  secure: boolean;
  user: string | undefined;
  pass: string | undefined;
  /** The local fake server has no TLS; a real server must offer it. */
  requireTls: boolean;
}

/**
 * The configured SMTP server (under `npm start` without SMTP_HOST: the local stand-in, which the
 * supervisor configures like any other). TLS is required of a mail server elsewhere; one on
 * this machine (the stand-in, a local relay) is reached without leaving it.
 */
export function smtpTarget(config: Config): SmtpTarget {
  const host = config.smtp.host;
  if (!host) throw new Error("No SMTP_HOST configured and no local mail stand-in started.");
  return { ...config.smtp, host, requireTls: !config.smtp.secure && !isLoopbackHost(host) };
}

export function createMailer(target: SmtpTarget, from: string): Mailer {
  const local = isLoopbackHost(target.host) && !target.requireTls;
  const transport = nodemailer.createTransport({
    host: target.host,
    port: target.port,
    secure: target.secure,
    requireTLS: target.requireTls,
    ignoreTLS: local,
    ...(target.user ? { auth: { user: target.user, pass: target.pass ?? "" } } : {}),
    connectionTimeout: 10_000,
    greetingTimeout: 10_000,
    socketTimeout: 20_000,
  });
  const inFlight = new Set<Promise<unknown>>();
  return {
    async send(to, content, options = {}) {
      const headers = options.teamId ? { [TEAM_HEADER]: options.teamId } : undefined;
      const sending = transport.sendMail({ from, to, ...content, headers });
      inFlight.add(sending);
      try {
        await sending;
      } finally {
        inFlight.delete(sending);
      }
    },
    async close() {
      await Promise.allSettled([...inFlight]);
      transport.close();
    },
  };
}
