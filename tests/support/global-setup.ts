import { databaseName } from "../../server/db/client";
import { runMigrations } from "../../server/db/migrate";

/**
 * Shared by the integration and e2e projects. Tests write to the database they are given, so
 * they refuse any database whose name does not end in _test (the user's data must be safe).
 */
export default async function setup(): Promise<void> {
  const url = process.env.DATABASE_URL;
  if (!url) {
    throw new Error("DATABASE_URL is not set. Run the tests with `npm test`, which provides one.");
  }
  const name = databaseName(url);
  if (!name.endsWith("_test")) {
    throw new Error(
      `Refusing to run tests against the database "${name}": its name must end in _test. ` +
        "Run `npm test`, which creates and uses its own test database.",
    );
  }
  await runMigrations(url);
}
