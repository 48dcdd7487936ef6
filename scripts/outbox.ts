/**
 * Command line: `npm run outbox [-- <address>] [--limit N]`.
 *
 * The local mail server keeps every message in the database instead of delivering it. In the
 * app, people see only their own mail (and managers their team's invitations), so a sign-up
 * confirmation for an address that has no account yet is readable by nobody there: whoever runs
 * this machine reads it here, as they could with psql. Prints the newest messages, in full.
 */
import { parseArgs } from "node:util";
import { desc, eq } from "drizzle-orm";
import { connectDatabase } from "../server/db/client";
import { outboxMessages } from "../server/db/schema";

const USAGE = "usage: npm run outbox -- [address] [--limit N]";

async function main(argv: string[]): Promise<number> {
  const { values, positionals } = parseArgs({
    args: argv,
    allowPositionals: true,
    options: { limit: { type: "string", default: "3" }, help: { type: "boolean" } },
  });
  const limit = Number(values.limit);
  if (values.help || positionals.length > 1 || !Number.isInteger(limit) || limit < 1) {
    process.stderr.write(`${USAGE}\n`);
    return values.help ? 0 : 2;
  }
  const url = process.env.DATABASE_URL;
  if (!url) {
    process.stderr.write("DATABASE_URL is not set: run this through `npm run outbox`.\n");
    return 2;
  }
  const address = positionals[0]?.trim().toLowerCase();
  const { pool, db } = connectDatabase(url, 1);
  try {
    const rows = await db
      .select()
      .from(outboxMessages)
      .where(address ? eq(outboxMessages.to, address) : undefined)
      .orderBy(desc(outboxMessages.receivedAt))
      .limit(limit);
    if (rows.length === 0) {
      process.stdout.write(address ? `No mail to ${address}.\n` : "No mail yet.\n");
    }
    for (const row of rows.reverse()) {
      process.stdout.write(
        [
          "─".repeat(72),
          `Sent:    ${row.receivedAt.toISOString()}`,
          `To:      ${row.to}`,
          `Subject: ${row.subject}`,
          "",
          row.text.trim(),
          "",
        ].join("\n"),
      );
    }
    return 0;
  } finally {
    await pool.end();
  }
}

main(process.argv.slice(2)).then(
  (code) => process.exit(code),
  (err: unknown) => {
    process.stderr.write(`${err instanceof Error ? err.message : String(err)}\n`);
    process.exit(1);
  },
);
