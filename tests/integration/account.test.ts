import supertest from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createUser, sessionCookie, signIn, startTestApp, type TestApp } from "../support/app";

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(() => t.close());

describe("account", () => {
  it("changes the display name", async () => {
    const user = await createUser(t.db, "account-name");
    const agent = t.agent();
    await signIn(agent, user);
    const res = await agent.patch("/api/account").send({ name: "  Ada Quist  " });
    expect(res.status).toBe(200);
    expect(res.body.user.name).toBe("Ada Quist");
    expect((await agent.get("/api/account")).body.user.name).toBe("Ada Quist");
  });

  it("refuses a password change with a wrong current password, naming that field", async () => {
    const user = await createUser(t.db, "account-wrong");
    const agent = t.agent();
    await signIn(agent, user);
    const res = await agent
      .post("/api/account/password")
      .send({ currentPassword: "not-my-password", newPassword: "another-long-one" });
    expect(res.status).toBe(422);
    expect(Object.keys(res.body.error.fields)).toEqual(["currentPassword"]);
  });

  it("changes the password, keeps this session and ends the others", async () => {
    const user = await createUser(t.db, "account-change");
    const here = t.agent();
    await signIn(here, user);
    const elsewhere = sessionCookie(await signIn(t.agent(), user))?.split(";")[0] ?? "";
    const res = await here
      .post("/api/account/password")
      .send({ currentPassword: user.password, newPassword: "another-long-one" });
    expect(res.status).toBe(204);
    expect((await here.get("/api/account")).status).toBe(200);
    expect((await supertest(t.app).get("/api/account").set("Cookie", elsewhere)).status).toBe(401);
    const signInNew = await t
      .agent()
      .post("/api/auth/sign-in")
      .send({ email: user.email, password: "another-long-one" });
    expect(signInNew.status).toBe(200);
  });
});
