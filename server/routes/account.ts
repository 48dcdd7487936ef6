import { eq } from "drizzle-orm";
import { Router } from "express";
import { changePasswordBody, updateAccountBody } from "../../shared/schemas/auth";
import { currentUser, requireUser } from "../auth/guards";
import { hashPassword, verifyPassword } from "../auth/password";
import { deleteUserSessions } from "../auth/session";
import { sessionInfo } from "../auth/session-info";
import { users } from "../db/schema";
import { invalidInput } from "../http/errors";
import { validate } from "../http/validate";
import type { RouteDeps } from "./deps";

export function accountRouter({ db }: RouteDeps): Router {
  const router = Router();
  router.use("/account", requireUser(db));

  router.get("/account", async (req, res) => {
    res.json(await sessionInfo(db, currentUser(req).id));
  });

  router.patch("/account", async (req, res) => {
    const body = validate(updateAccountBody, req.body);
    const user = currentUser(req);
    await db.update(users).set({ name: body.name }).where(eq(users.id, user.id));
    res.json(await sessionInfo(db, user.id));
  });

  router.post("/account/password", async (req, res) => {
    const body = validate(changePasswordBody, req.body);
    const user = currentUser(req);
    const [row] = await db
      .select({ passwordHash: users.passwordHash })
      .from(users)
      .where(eq(users.id, user.id));
    if (!row || !(await verifyPassword(row.passwordHash, body.currentPassword))) {
      throw invalidInput({ currentPassword: "Your current password is not right." });
    }
    const passwordHash = await hashPassword(body.newPassword);
    await db.transaction(async (tx) => {
      await tx.update(users).set({ passwordHash }).where(eq(users.id, user.id));
      // Keep this browser signed in; sign out every other device.
      await deleteUserSessions(tx, user.id, req.sessionID);
    });
    res.status(204).end();
  });

  return router;
}
