import { useEffect } from "react";
import { Navigate, Outlet, useLocation, useNavigate, useParams } from "react-router-dom";
import { AppShell } from "../components/AppShell";
import { useSignOut } from "../features/auth/api/sign-out";
import { useProject } from "../features/projects/api/get-project";
import { readLastTeam, rememberTeam } from "../lib/last-team";
import { signInPath } from "../lib/navigation";
import { usePublicConfig, useSession } from "../lib/session";
import { NoTeam } from "./NoTeam";

/** The frame of every page that needs a session; sends others to sign-in and back. */
export function SignedInLayout() {
  const session = useSession();
  const config = usePublicConfig();
  const location = useLocation();
  const navigate = useNavigate();
  const params = useParams();
  const project = useProject(session ? params.projectId : undefined);
  const signOut = useSignOut();

  const memberships = session?.memberships ?? [];
  const isMember = (teamId: string | null | undefined) =>
    Boolean(teamId && memberships.some((m) => m.teamId === teamId));
  const routeTeam = params.teamId ?? project.data?.teamId;
  const lastTeam = readLastTeam();
  const currentTeamId = isMember(routeTeam)
    ? routeTeam
    : isMember(lastTeam)
      ? (lastTeam ?? undefined)
      : memberships[0]?.teamId;

  useEffect(() => {
    if (currentTeamId) rememberTeam(currentTeamId);
  }, [currentTeamId]);

  if (!session) {
    const here = location.pathname + location.search;
    return <Navigate to={here === "/" ? "/sign-in" : signInPath(here)} replace />;
  }

  // Everyone has their own mail there; managers also their team's invitations.
  const showOutbox = config.outboxEnabled;
  const needsTeam = memberships.length === 0 && location.pathname !== "/account";

  return (
    <AppShell
      user={session.user}
      memberships={memberships}
      currentTeamId={currentTeamId}
      onTeamChange={(teamId) => navigate(`/teams/${teamId}/projects`)}
      showOutbox={showOutbox}
      signingOut={signOut.isPending}
      onSignOut={() => signOut.mutate(undefined, { onSuccess: () => navigate("/sign-in") })}
    >
      {needsTeam ? <NoTeam /> : <Outlet />}
    </AppShell>
  );
}
