import { Navigate } from "react-router-dom";
import { readLastTeam } from "../lib/last-team";
import { useRequiredSession } from "../lib/session";

/** "/" opens the projects of the team last worked in, or the first team. */
export function HomeRedirect() {
  const session = useRequiredSession();
  const last = readLastTeam();
  const team = session.memberships.find((m) => m.teamId === last) ?? session.memberships[0] ?? null;
  return <Navigate to={team ? `/teams/${team.teamId}/projects` : "/account"} replace />;
}
