import { and, eq, isNull } from "drizzle-orm";
import { Router } from "express";
import {
  resetCompleteBody,
  resetRequestBody,
  signInBody,
  signUpBody,
  tokenBody,
} from "../../shared/schemas/auth";
import { currentUser, requireUser } from "../auth/guards";
import { hashPassword, needsRehash, verifyAgainstDummy, verifyPassword } from "../auth/password";
import { createPasswordReset } from "../auth/password-resets";
import { deleteUserSessions, destroySession, SESSION_COOKIE, signInSession } from "../auth/session";
import { sessionInfo } from "../auth/session-info";
import { expiresIn, hashToken, newToken, TOKEN_LIFETIME_MS } from "../auth/tokens";
import { isUniqueViolation } from "../db/errors";
import { emailConfirmations, memberships, passwordResets, teams, users } from "../db/schema";
import { HttpError, linkExpired, notFound } from "../http/errors";
import { validate } from "../http/validate";
import { confirmEmailMail, passwordResetMail, signUpExistingMail } from "../mail/templates";
import { ensureTeamCatalog } from "../geodata/catalog-seed";
import { afterAnswer, sendInBackground, type RouteDeps } from "./deps";

const accountExists = () =>
  new HttpError(
    409,
    "account_exists",
    "An account with this e-mail address already exists. Sign in instead.",
  );

export function authRouter(deps: RouteDeps): Router {
  const { db, config, mailer, limiters } = deps;
  const baseUrl = config.publicBaseUrl;
  const router = Router();

  router.post("/auth/sign-in", async (req, res) => {
    const body = validate(signInBody, req.body);
    const attempt = await limiters.signIn.begin(req, res, body.email);
    const [user] = await db.select().from(users).where(eq(users.email, body.email));
    const ok = user
      ? await verifyPassword(user.passwordHash, body.password)
      : await verifyAgainstDummy(body.password);
    if (!user || !ok) {
      await attempt.failed();
      throw new HttpError(401, "invalid_credentials", "The e-mail address or password is wrong.");
    }
    if (needsRehash(user.passwordHash)) {
      const passwordHash = await hashPassword(body.password);
      await db.update(users).set({ passwordHash }).where(eq(users.id, user.id));
    }
    await signInSession(req, user.id);
    await attempt.succeeded();
    res.json(await sessionInfo(db, user.id));
  });

  router.post("/auth/sign-out", requireUser(db), async (req, res) => {
    await destroySession(req);
    res.clearCookie(SESSION_COOKIE, { path: "/" });
    res.status(204).end();
  });

  router.get("/auth/me", requireUser(db), async (req, res) => {
    res.json(await sessionInfo(db, currentUser(req).id));
  });

  router.post("/auth/sign-up", limiters.emailRequest, async (req, res) => {
    if (!config.signUpEnabled) {
      throw new HttpError(
        403,
        "signup_disabled",
        "Sign-up is turned off here. Ask a team admin to invite you.",
      );
    }
    const body = validate(signUpBody, req.body);
    // Hash in both branches so the answer time does not reveal whether the address is known.
    const passwordHash = await hashPassword(body.password);
    const [existing] = await db
      .select({ name: users.name })
      .from(users)
      .where(eq(users.email, body.email));
    if (existing) {
      sendInBackground(mailer, body.email, signUpExistingMail({ baseUrl, name: existing.name }));
    } else {
      const { token, tokenHash } = newToken();
      await db.insert(emailConfirmations).values({
        email: body.email,
        name: body.name,
        passwordHash,
        teamName: body.teamName,
        tokenHash,
        expiresAt: expiresIn(TOKEN_LIFETIME_MS.emailConfirmation),
      });
      const mail = confirmEmailMail({ baseUrl, token, name: body.name, teamName: body.teamName });
      sendInBackground(mailer, body.email, mail);
    }
    res.status(202).json({
      message: `We sent a message to ${body.email}. Follow its link to finish signing up.`,
    });
  });

  router.post("/auth/confirm-email", async (req, res) => {
    const { token } = validate(tokenBody, req.body);
    const userId = await db
      .transaction(async (tx) => {
        const [pending] = await tx
          .select()
          .from(emailConfirmations)
          .where(eq(emailConfirmations.tokenHash, hashToken(token)))
          .for("update");
        if (!pending) throw notFound("This confirmation link");
        if (pending.usedAt || pending.expiresAt <= new Date()) throw linkExpired();
        const [taken] = await tx
          .select({ id: users.id })
          .from(users)
          .where(eq(users.email, pending.email));
        if (taken) throw accountExists();
        const [user] = await tx
          .insert(users)
          .values({ email: pending.email, name: pending.name, passwordHash: pending.passwordHash })
          .returning({ id: users.id });
        const [team] = await tx
          .insert(teams)
          .values({ name: pending.teamName })
          .returning({ id: teams.id });
        if (!user || !team) throw new Error("insert returned no row");
        await tx.insert(memberships).values({ teamId: team.id, userId: user.id, role: "owner" });
        await ensureTeamCatalog(tx, team.id);
        await tx
          .update(emailConfirmations)
          .set({ usedAt: new Date() })
          .where(eq(emailConfirmations.id, pending.id));
        return user.id;
      })
      .catch((err: unknown) => {
        // Two confirmations for one address racing each other: the second one loses here.
        throw isUniqueViolation(err) ? accountExists() : err;
      });
    await signInSession(req, userId);
    res.status(201).json(await sessionInfo(db, userId));
  });

  router.post("/auth/password-reset/request", limiters.emailRequest, async (req, res) => {
    const { email } = validate(resetRequestBody, req.body);
    // The answer is the same and comes before the account is even looked up, so neither its
    // content nor its time can tell whether the address has an account.
    res.status(202).json({
      message: `If ${email} has a Rillmark account, a message with a reset link is on its way.`,
    });
    afterAnswer(res, async () => {
      const { token, tokenHash } = newToken();
      const expiresAt = expiresIn(TOKEN_LIFETIME_MS.passwordReset);
      const user = await createPasswordReset(db, email, tokenHash, expiresAt);
      if (user) await mailer.send(email, passwordResetMail({ baseUrl, token, name: user.name }));
    });
  });

  router.post("/auth/password-reset/complete", async (req, res) => {
    const body = validate(resetCompleteBody, req.body);
    const passwordHash = await hashPassword(body.password);
    const email = await db.transaction(async (tx) => {
      const [reset] = await tx
        .select()
        .from(passwordResets)
        .where(eq(passwordResets.tokenHash, hashToken(body.token)))
        .for("update");
      if (!reset) throw notFound("This reset link");
      if (reset.usedAt || reset.expiresAt <= new Date()) throw linkExpired();
      const [user] = await tx
        .update(users)
        .set({ passwordHash })
        .where(eq(users.id, reset.userId))
        .returning({ email: users.email });
      // Every other outstanding link for the account dies with this one.
      await tx
        .update(passwordResets)
        .set({ usedAt: new Date() })
        .where(and(eq(passwordResets.userId, reset.userId), isNull(passwordResets.usedAt)));
      await deleteUserSessions(tx, reset.userId);
      return user?.email;
    });
    // Whoever holds the mailbox has proved it: others' wrong guesses no longer make them wait.
    if (email) await limiters.signIn.forget(email);
    res.status(204).end();
  });

  return router;
}
