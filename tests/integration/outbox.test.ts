import { randomUUID } from "node:crypto";
import { eq } from "drizzle-orm";
import supertest from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { outboxMessages } from "../../server/db/schema";
import { TEAM_HEADER } from "../../server/mail/mailer";
import {
  createTeam,
  latestMailTo,
  localMailer,
  signIn,
  startTestApp,
  tokenFromMail,
  uniqueEmail,
  type Agent,
  type TestApp,
  type TestTeam,
} from "../support/app";

let t: TestApp;
let team: TestTeam;
let admin: Agent;

beforeAll(async () => {
  t = await startTestApp();
  team = await createTeam(t.db, "outbox");
  admin = t.agent();
  await signIn(admin, team.members.admin);
});
afterAll(() => t.close());

/** Signs up through the API like anyone on the internet: the result owns a new team. */
async function signUpNewOwner(tag: string): Promise<{ agent: Agent; email: string }> {
  const email = uniqueEmail(tag);
  const agent = t.agent();
  const asked = await agent.post("/api/auth/sign-up").send({
    email,
    name: `Owner ${tag}`,
    password: "a long enough password",
    teamName: `Team of ${tag}`,
  });
  expect(asked.status).toBe(202);
  // Their own inbox: the harness reads it from the store, as they would from their mail.
  const token = tokenFromMail(await latestMailTo(t.db, email), "/confirm-email");
  const confirmed = await agent.post("/api/auth/confirm-email").send({ token });
  expect(confirmed.status).toBe(201);
  expect(confirmed.body.memberships).toEqual([expect.objectContaining({ role: "owner" })]);
  return { agent, email };
}

async function outboxIds(agent: Agent): Promise<string[]> {
  const list = await agent.get("/api/outbox");
  expect(list.status).toBe(200);
  return (list.body as { id: string }[]).map((m) => m.id);
}

describe("outbox", () => {
  it("shows an admin the team's invitations, newest first, and each message in full", async () => {
    const email = uniqueEmail("outbox-invitee");
    await admin.post(`/api/teams/${team.id}/invitations`).send({ email, role: "viewer" });
    const stored = await latestMailTo(t.db, email);
    expect(stored.teamId).toBe(team.id);
    const list = await admin.get("/api/outbox");
    expect(list.status).toBe(200);
    const times = (list.body as { receivedAt: string }[]).map((m) => Date.parse(m.receivedAt));
    expect(times).toEqual([...times].sort((a, b) => b - a));
    expect(list.body).toContainEqual({
      id: stored.id,
      to: email,
      from: expect.stringContaining("Rillmark"),
      subject: expect.stringContaining(team.name),
      receivedAt: expect.any(String),
    });
    const one = await admin.get(`/api/outbox/${stored.id}`);
    expect(one.status).toBe(200);
    expect(one.body.text).toContain("/invitations/");
    expect(one.body.html).toContain("<a href=");
  });

  it("never shows another team's owner a reset link: the takeover path is closed", async () => {
    const victim = team.members.owner;
    const attacker = await signUpNewOwner("outbox-attacker");
    const asked = await supertest(t.app)
      .post("/api/auth/password-reset/request")
      .send({ email: victim.email });
    expect(asked.status).toBe(202);
    const resetMail = await latestMailTo(t.db, victim.email);
    expect(resetMail.teamId).toBeNull();

    expect(await outboxIds(attacker.agent)).not.toContain(resetMail.id);
    const direct = await attacker.agent.get(`/api/outbox/${resetMail.id}`);
    const unknown = await attacker.agent.get(`/api/outbox/${randomUUID()}`);
    expect(direct.status).toBe(404);
    expect(direct.body).toEqual(unknown.body);
    // Nor does the victim's own team admin read it: a reset is personal.
    expect(await outboxIds(admin)).not.toContain(resetMail.id);
    expect((await admin.get(`/api/outbox/${resetMail.id}`)).status).toBe(404);

    // Without the link the attacker cannot reset; the victim's password still works.
    const guessed = await attacker.agent
      .post("/api/auth/password-reset/complete")
      .send({ token: "x".repeat(43), password: "attacker chose this" });
    expect(guessed.status).toBe(404);
    await signIn(t.agent(), victim);

    // The owner it was sent to reads it, and only they can use it.
    const owner = t.agent();
    await signIn(owner, victim);
    expect(await outboxIds(owner)).toContain(resetMail.id);
    const mine = await owner.get(`/api/outbox/${resetMail.id}`);
    expect(mine.status).toBe(200);
    expect(mine.body.text).toContain(tokenFromMail(resetMail, "/reset-password"));
  });

  it("keeps a team's invitation links from another team's owner and from its own members", async () => {
    const attacker = await signUpNewOwner("outbox-invite-attacker");
    const invitee = uniqueEmail("outbox-target");
    const sent = await admin
      .post(`/api/teams/${team.id}/invitations`)
      .send({ email: invitee, role: "admin" });
    expect(sent.status).toBe(201);
    const mail = await latestMailTo(t.db, invitee);

    expect(await outboxIds(attacker.agent)).not.toContain(mail.id);
    expect((await attacker.agent.get(`/api/outbox/${mail.id}`)).status).toBe(404);
    const token = tokenFromMail(mail, "/invitations");
    // The link itself still works for whoever really holds it; the attacker never sees it.
    expect((await supertest(t.app).get(`/api/invitations/${token}`)).status).toBe(200);

    const engineer = t.agent();
    await signIn(engineer, team.members.engineer);
    expect(await outboxIds(engineer)).not.toContain(mail.id);
    const owner = t.agent();
    await signIn(owner, team.members.owner);
    expect(await outboxIds(owner)).toContain(mail.id);
  });

  it("files a message under no team when the team header is not a team id", async () => {
    const to = uniqueEmail("outbox-header");
    const mailer = localMailer(t.smtp.port, t.smtpCredentials, t.config.mailFrom);
    try {
      await mailer.send(to, { subject: "s", text: "t", html: "<p>t</p>" }, { teamId: "x' or 1=1" });
    } finally {
      await mailer.close();
    }
    const stored = await latestMailTo(t.db, to);
    expect(stored.teamId).toBeNull();
    expect(stored.raw).toContain(`${TEAM_HEADER}: x' or 1=1`);
    const [row] = await t.db.select().from(outboxMessages).where(eq(outboxMessages.id, stored.id));
    expect(row?.to).toBe(to);
  });

  it("is not there (404) when the app runs in production", async () => {
    const prod = await startTestApp({ outboxEnabled: false });
    try {
      const res = await supertest(prod.app).get("/api/outbox");
      expect(res.status).toBe(404);
      const config = await supertest(prod.app).get("/api/config");
      expect(config.body.outboxEnabled).toBe(false);
    } finally {
      await prod.close();
    }
  });
});
