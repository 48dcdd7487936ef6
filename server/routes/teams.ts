import { Router } from "express";
import type { Team } from "../../shared/schemas/team";
import { currentTeam, loadTeamMembership, requirePermission, requireUser } from "../auth/guards";
import type { RouteDeps } from "./deps";

export function teamsRouter({ db }: RouteDeps): Router {
  const router = Router();

  router.get(
    "/teams/:teamId",
    requireUser(db),
    loadTeamMembership(db),
    requirePermission("team:read"),
    (req, res) => {
      const access = currentTeam(req);
      const team: Team = { id: access.teamId, name: access.teamName, role: access.role };
      res.json(team);
    },
  );

  return router;
}
