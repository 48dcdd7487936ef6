// The project's .env, read the way the server reads it (real environment variables win), so
// that the bootstrap and the server agree on DATABASE_URL, PORT and the rest.
import fs from "node:fs";
import path from "node:path";
import util from "node:util";

/** Pure fallback for Node < 20.12 (no util.parseEnv): KEY=value lines, quotes, comments. */
export function parseDotEnv(text) {
  const values = {};
  for (const raw of text.split(/\r?\n/)) {
    const line = raw.trim().replace(/^export\s+/, "");
    const match = /^([A-Za-z_][A-Za-z0-9_.-]*)\s*=\s*(.*)$/.exec(line);
    if (!match) continue;
    const [, key, rest] = match;
    let value = rest.trim();
    const quote = value[0];
    if ((quote === '"' || quote === "'" || quote === "`") && value.indexOf(quote, 1) > 0) {
      value = value.slice(1, value.indexOf(quote, 1));
      if (quote === '"') value = value.replace(/\\n/g, "\n");
    } else {
      value = value.replace(/\s+#.*$/, "");
    }
    values[key] = value;
  }
  return values;
}

/** Copy .env's variables into process.env where not already set; returns the names set. */
export function loadDotEnv(root) {
  const file = path.join(root, ".env");
  let text;
  try {
    text = fs.readFileSync(file, "utf8");
  } catch {
    return [];
  }
  const values = typeof util.parseEnv === "function" ? util.parseEnv(text) : parseDotEnv(text);
  const set = [];
  for (const [key, value] of Object.entries(values)) {
    if (process.env[key] === undefined) {
      process.env[key] = value;
      set.push(key);
    }
  }
  return set;
}
