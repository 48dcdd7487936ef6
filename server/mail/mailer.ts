import nodemailer from "nodemailer";
import type { Config } from "../config";
import type { MailContent } from "./templates";

export interface Mailer {
  send(to: string, content: MailContent): Promise<void>;
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

/** The configured SMTP server, or the local fake one listening on `fakeSmtpPort`. */
export function smtpTarget(config: Config, fakeSmtpPort?: number): SmtpTarget {
  if (config.smtp.host) {
    return { ...config.smtp, host: config.smtp.host, requireTls: !config.smtp.secure };
  }
  if (fakeSmtpPort === undefined) {
    throw new Error("No SMTP_HOST configured and no local mail server started.");
  }
  return {
    host: "127.0.0.1",
    port: fakeSmtpPort,
    secure: false,
    user: undefined,
    pass: undefined,
    requireTls: false,
  };
}

export function createMailer(target: SmtpTarget, from: string): Mailer {
  const local = target.host === "127.0.0.1" && !target.requireTls;
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
    async send(to, content) {
      const sending = transport.sendMail({ from, to, ...content });
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
