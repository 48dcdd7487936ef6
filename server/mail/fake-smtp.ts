import { createHash, timingSafeEqual } from "node:crypto";
import type { AddressInfo } from "node:net";
import type { Readable } from "node:stream";
import { idSchema } from "../../shared/schemas/common";
import { simpleParser, type AddressObject } from "mailparser";
import { SMTPServer } from "smtp-server";
import type { Db } from "../db/client";
import { outboxMessages } from "../db/schema";
import { TEAM_HEADER } from "./mailer";

export interface SmtpCredentials {
  user: string;
  pass: string;
}

/** Compares without leaking where two strings differ (hashes first: equal lengths). */
function sameSecret(given: string | null | undefined, expected: string): boolean {
  const digest = (v: string) => createHash("sha256").update(v).digest();
  return timingSafeEqual(digest(given ?? ""), digest(expected));
}

export interface FakeSmtp {
  port: number;
  close(): Promise<void>;
}

const MAX_MESSAGE_BYTES = 10 * 1024 * 1024;
const isUuid = (value: string) => idSchema.safeParse(value).success;

async function readAll(stream: Readable): Promise<Buffer> {
  const chunks: Buffer[] = [];
  for await (const chunk of stream) chunks.push(Buffer.from(chunk as Uint8Array));
  return Buffer.concat(chunks);
}

function addressText(value: AddressObject | AddressObject[] | undefined): string {
  if (!value) return "";
  return (Array.isArray(value) ? value : [value]).map((a) => a.text).join(", ");
}

/**
 * A mail server on loopback that keeps every message in outbox_messages, so development and
 * tests send real SMTP without any mail leaving the machine. Read it on the Outbox page.
 */
export async function startFakeSmtp(
  db: Db,
  credentials: SmtpCredentials,
  port = 0,
): Promise<FakeSmtp> {
  const server = new SMTPServer({
    name: "rillmark-outbox.localhost",
    banner: "Rillmark local outbox (nothing is delivered)",
    // Anyone on the machine could otherwise write into the Outbox: AUTH first, always.
    authOptional: false,
    authMethods: ["PLAIN", "LOGIN"],
    // Loopback only and nothing leaves the machine: no TLS, so AUTH goes in the clear.
    allowInsecureAuth: true,
    disabledCommands: ["STARTTLS"],
    size: MAX_MESSAGE_BYTES,
    logger: false,
    onAuth(auth, _session, callback) {
      if (
        sameSecret(auth.username, credentials.user) &&
        sameSecret(auth.password, credentials.pass)
      ) {
        callback(null, { user: credentials.user });
      } else {
        callback(Object.assign(new Error("Invalid username or password"), { responseCode: 535 }));
      }
    },
    onData(stream, session, callback) {
      const store = async () => {
        const raw = await readAll(stream);
        if ((stream as Readable & { sizeExceeded?: boolean }).sizeExceeded) {
          throw Object.assign(new Error("Message too large"), { responseCode: 552 });
        }
        const parsed = await simpleParser(raw);
        const team = parsed.headers.get(TEAM_HEADER.toLowerCase());
        // The envelope says who the message was actually delivered to; headers can differ.
        const to = session.envelope.rcptTo.map((r) => r.address.toLowerCase()).join(", ");
        const mailFrom = session.envelope.mailFrom;
        await db.insert(outboxMessages).values({
          // Anything but a well-formed id is no team: the message stays personal.
          teamId: typeof team === "string" && isUuid(team.trim()) ? team.trim() : null,
          to: to || addressText(parsed.to),
          from: addressText(parsed.from) || (mailFrom ? mailFrom.address : ""),
          subject: parsed.subject ?? "",
          text: parsed.text ?? "",
          html: typeof parsed.html === "string" ? parsed.html : null,
          raw: raw.toString("utf8"),
        });
      };
      store().then(
        () => callback(),
        (err: unknown) => callback(err instanceof Error ? err : new Error(String(err))),
      );
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.server.once("error", reject);
    server.listen(port, "127.0.0.1", () => resolve());
  });
  const address = server.server.address() as AddressInfo;
  return {
    port: address.port,
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}
