// Temporary folders for the bootstrap's self-tests, removed when the test file ends.
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { after } from "node:test";

const made = [];
let registered = false;

export function tempDir() {
  if (!registered) {
    after(() => {
      for (const dir of made) fs.rmSync(dir, { recursive: true, force: true });
    });
    registered = true;
  }
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), "rillmark-selftest-"));
  made.push(dir);
  return dir;
}
