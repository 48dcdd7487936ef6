import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import {
  ConfigError,
  DEFAULT_SESSION_SECRET,
  ENV_VARIABLES,
  loadConfig,
  resolvePublicBaseUrl,
} from "../../server/config";
import { startRillmark } from "../../server/main";

const DB = "postgres://postgres@127.0.0.1:5432/rillmark_test";
const LONG_SECRET = "k3Jd9sLq0vXw2mNb7rTy5uZa8cEf1gHi4jKl6oPp";

describe("configuration", () => {
  it("has safe local defaults", () => {
    const config = loadConfig({ DATABASE_URL: DB });
    expect(config).toMatchObject({
      port: 5180,
      host: "127.0.0.1",
      signUpEnabled: true,
      outboxEnabled: true,
      clientDist: "dist/client",
      fakeSmtpPort: 0,
    });
    expect(resolvePublicBaseUrl(config, config.port)).toBe("http://127.0.0.1:5180");
  });

  it("turns the Outbox off once a real mail server is configured", () => {
    const outbox = (env: Record<string, string>) => loadConfig({ DATABASE_URL: DB, ...env });
    expect(outbox({ SMTP_HOST: "mail.example.test" }).outboxEnabled).toBe(false);
    // npm start hands its app processes the local stand-in's address: still development mail.
    expect(outbox({ SMTP_HOST: "127.0.0.1" }).outboxEnabled).toBe(true);
  });

  it("documents every variable it reads in .env.example", () => {
    const example = readFileSync(new URL("../../.env.example", import.meta.url), "utf8");
    const documented = [...example.matchAll(/^#? ?([A-Z][A-Z0-9_]*)=/gm)].map((m) => m[1]);
    expect([...documented].sort()).toEqual([...ENV_VARIABLES].sort());
  });

  it("requires DATABASE_URL and says so", () => {
    expect(() => loadConfig({})).toThrow(/DATABASE_URL/);
  });

  it("names each bad setting", () => {
    expect(() => loadConfig({ DATABASE_URL: DB, PORT: "eighty", SIGNUP_ENABLED: "maybe" })).toThrow(
      /PORT[\s\S]*SIGNUP_ENABLED|SIGNUP_ENABLED[\s\S]*PORT/,
    );
  });

  it("reads switches and trims a trailing slash from the public address", () => {
    const config = loadConfig({
      DATABASE_URL: DB,
      SIGNUP_ENABLED: "false",
      PUBLIC_BASE_URL: "https://drainage.example.test/",
    });
    expect(config.signUpEnabled).toBe(false);
    expect(config.publicBaseUrl).toBe("https://drainage.example.test");
  });

  it("refuses to start in production with the default session secret", () => {
    const env = { DATABASE_URL: DB, NODE_ENV: "production", SMTP_HOST: "smtp.example.test" };
    expect(() => loadConfig(env)).toThrow(ConfigError);
    expect(() => loadConfig(env)).toThrow(/SESSION_SECRET/);
  });

  it("refuses a production secret shorter than 32 characters", () => {
    const env = {
      DATABASE_URL: DB,
      NODE_ENV: "production",
      SMTP_HOST: "smtp.example.test",
      SESSION_SECRET: "short-secret",
    };
    expect(() => loadConfig(env)).toThrow(/at least 32/);
  });

  it("starts in production with a long secret, SMTP and S3, and turns the outbox off", () => {
    const config = loadConfig({
      DATABASE_URL: DB,
      NODE_ENV: "production",
      SMTP_HOST: "smtp.example.test",
      SESSION_SECRET: LONG_SECRET,
      S3_ENDPOINT: "https://s3.example.test",
    });
    expect(config.outboxEnabled).toBe(false);
    expect(config.storage.endpoint).toBe("https://s3.example.test");
  });

  it("refuses production without an S3 endpoint", () => {
    expect(() =>
      loadConfig({
        DATABASE_URL: DB,
        NODE_ENV: "production",
        SESSION_SECRET: LONG_SECRET,
        SMTP_HOST: "smtp.example.test",
      }),
    ).toThrow(/S3_ENDPOINT/);
  });

  it("reads upload limits per kind of file, in bytes", () => {
    const config = loadConfig({
      DATABASE_URL: DB,
      UPLOAD_LIMIT_VECTOR_MB: "5",
      UPLOAD_LIMIT_TERRAIN_MB: "7",
      UPLOAD_LIMIT_RAINFALL_KB: "3",
    });
    expect(config.uploads.limitsBytes).toEqual({
      vector: 5 * 1024 * 1024,
      terrain: 7 * 1024 * 1024,
      rainfall: 3 * 1024,
    });
  });

  it("refuses production without an SMTP server", () => {
    expect(() =>
      loadConfig({ DATABASE_URL: DB, NODE_ENV: "production", SESSION_SECRET: LONG_SECRET }),
    ).toThrow(/SMTP_HOST/);
  });

  it("makes startRillmark refuse production overrides with the default secret", async () => {
    await expect(
      startRillmark({
        databaseUrl: DB,
        nodeEnv: "production",
        sessionSecret: DEFAULT_SESSION_SECRET,
        smtp: {
          host: "smtp.example.test",
          port: 587,
          secure: false,
          user: undefined,
          pass: undefined,
        },
      }),
    ).rejects.toThrow(/SESSION_SECRET/);
  });
});
