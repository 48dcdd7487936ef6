// Helpers for the readers' tests: fixture paths and copies under a name of the test's choosing.
import { copyFileSync, mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { ReadError } from "./types";

export const FIXTURES = fileURLToPath(new URL("../../../tests/fixtures/geo", import.meta.url));
export const fixture = (name: string): string => join(FIXTURES, name);

/** A private temp folder per test file (no shared state between files). */
export function tempDir(): string {
  return mkdtempSync(join(tmpdir(), "rillmark-readers-"));
}

export function copyAs(dir: string, source: string, name: string): string {
  const target = join(dir, name);
  copyFileSync(fixture(source), target);
  return target;
}

export function writeTemp(dir: string, name: string, bytes: Uint8Array | string): string {
  const target = join(dir, name);
  writeFileSync(target, bytes);
  return target;
}

/** The ReadError a promise rejects with (fails the test if it resolves or throws otherwise). */
export async function readErrorOf(run: () => Promise<unknown> | unknown): Promise<ReadError> {
  try {
    await run();
  } catch (error) {
    if (error instanceof ReadError) return error;
    throw error;
  }
  throw new Error("expected a ReadError, but the read succeeded");
}
