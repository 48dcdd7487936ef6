/**
 * The local S3 and SMTP stand-ins refuse anyone without their credentials (a security review
 * listed, read, wrote and deleted every team's stored files anonymously, and anyone on the machine
 * could write into the Outbox). Each attack is performed and must be refused.
 */
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { GetObjectCommand, S3Client } from "@aws-sdk/client-s3";
import nodemailer from "nodemailer";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { connectDatabase, type Database } from "../../server/db/client";
import {
  newStandInCredentials,
  startStandIns,
  type RunningStandIns,
  type StandInCredentials,
} from "../../server/standins";
import { ObjectStore } from "../../server/storage";
import { mailsTo, uniqueEmail } from "../support/app";

const BUCKET = "rillmark";
const KEY = "projects/p/layers/l/original.tif";
const dir = mkdtempSync(path.join(os.tmpdir(), "rillmark-standins-"));
let database: Database;
let standIns: RunningStandIns;
let credentials: StandInCredentials;
let store: ObjectStore;

beforeAll(async () => {
  database = connectDatabase(process.env.DATABASE_URL ?? "", 2);
  credentials = newStandInCredentials();
  standIns = await startStandIns({
    db: database.db,
    s3Dir: path.join(dir, "s3"),
    bucket: BUCKET,
    s3Port: 0,
    smtpPort: 0,
    credentials,
  });
  store = storeWith(credentials.s3);
  const file = path.join(dir, "object.bin");
  writeFileSync(file, "terrain bytes");
  await store.putFile(KEY, file);
});

afterAll(async () => {
  store?.close();
  await standIns?.close();
  await database?.pool.end();
  rmSync(dir, { recursive: true, force: true });
});

function storeWith(keys: { accessKeyId: string; secretAccessKey: string }) {
  return new ObjectStore({
    endpoint: standIns.s3Endpoint,
    bucket: BUCKET,
    region: "us-east-1",
    credentials: keys,
    forcePathStyle: true,
    cacheDir: path.join(dir, "cache"),
  });
}

describe("the S3 stand-in", () => {
  it("serves requests signed with its keys", async () => {
    expect(await store.list("projects/")).toEqual([KEY]);
  });

  it("refuses anonymous list, GET, PUT and DELETE, and keeps the object", async () => {
    const url = (p: string) => `${standIns.s3Endpoint}/${BUCKET}${p}`;
    const attempts = [
      fetch(url("?list-type=2")),
      fetch(url(`/${KEY}`)),
      fetch(url("/planted.txt"), { method: "PUT", body: "x" }),
      fetch(url(`/${KEY}`), { method: "DELETE" }),
    ];
    for (const res of await Promise.all(attempts)) expect(res.status).toBe(403);
    expect(await store.list("")).toEqual([KEY]);
  });

  it("refuses a request signed with a wrong secret or an unknown key", async () => {
    for (const keys of [
      { ...credentials.s3, secretAccessKey: `${credentials.s3.secretAccessKey}x` },
      newStandInCredentials().s3,
    ]) {
      const intruder = storeWith(keys);
      await expect(intruder.list("")).rejects.toMatchObject({ $metadata: { httpStatusCode: 403 } });
      intruder.close();
    }
  });

  it("refuses a signature 30 minutes old (a replayed request)", async () => {
    const client = new S3Client({
      endpoint: standIns.s3Endpoint,
      region: "us-east-1",
      credentials: credentials.s3,
      forcePathStyle: true,
      // Signs as if the clock were 30 minutes behind: what a captured request replayed looks like.
      systemClockOffset: -30 * 60_000,
    });
    await expect(
      client.send(new GetObjectCommand({ Bucket: BUCKET, Key: KEY })),
    ).rejects.toMatchObject({ $metadata: { httpStatusCode: 403 } });
    client.destroy();
  });
});

describe("the SMTP stand-in", () => {
  const transport = (auth?: { user: string; pass: string }) =>
    nodemailer.createTransport({
      host: "127.0.0.1",
      port: standIns.smtpPort,
      secure: false,
      ignoreTLS: true,
      ...(auth ? { auth } : {}),
    });
  const message = (to: string) => ({ from: "a@example.test", to, subject: "s", text: "t" });

  it("refuses mail without AUTH, and with a wrong password; keeps none of it", async () => {
    const to = uniqueEmail("smtp-refused");
    await expect(transport().sendMail(message(to))).rejects.toMatchObject({ responseCode: 530 });
    const wrong = { user: credentials.smtp.user, pass: `${credentials.smtp.pass}x` };
    await expect(transport(wrong).sendMail(message(to))).rejects.toMatchObject({
      responseCode: 535,
    });
    expect(await mailsTo(database.db, to)).toEqual([]);
  });

  it("keeps mail sent with its credentials in the Outbox", async () => {
    const to = uniqueEmail("smtp-accepted");
    await transport(credentials.smtp).sendMail(message(to));
    expect((await mailsTo(database.db, to)).length).toBe(1);
  });
});
