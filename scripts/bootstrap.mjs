#!/usr/bin/env node
// Rillmark's one-command set-up, run by npm start / test / run dev / run bench.
// Node built-ins only: it runs before node_modules exists and installs it.
//
//   node scripts/bootstrap.mjs start         set up, build the client if needed, serve
//   node scripts/bootstrap.mjs test [opts]   every check against a fresh test database
//   node scripts/bootstrap.mjs dev           Vite (hot reload) + API server under watch
//   node scripts/bootstrap.mjs bench         benchmarks against a fresh database
//   node scripts/bootstrap.mjs outbox [addr] print the mail the local mail server kept
//   node scripts/bootstrap.mjs db [name]     start the local PostgreSQL, print DATABASE_URL
//   node scripts/bootstrap.mjs db stop       stop it
//
// Progress is one line per step; full logs are in .data/logs/.
import { printError } from "./lib/log.mjs";
import { finish, installSignalHandlers } from "./lib/children.mjs";
import { bench, db, dev, outbox, start } from "./lib/commands.mjs";
import { test } from "./lib/test-run.mjs";

const COMMANDS = { start, test, dev, bench, db, outbox };

async function main() {
  const [name, ...args] = process.argv.slice(2);
  const command = COMMANDS[name];
  if (!command) {
    process.stderr.write(
      `usage: node scripts/bootstrap.mjs <${Object.keys(COMMANDS).join("|")}> [args]\n`,
    );
    process.exit(2);
  }
  installSignalHandlers();
  let code;
  try {
    code = await command(args);
  } catch (error) {
    printError(error);
    code = error?.exitCode ?? 1;
  }
  await finish(code ?? 0);
}

await main();
