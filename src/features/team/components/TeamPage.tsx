import { useParams } from "react-router-dom";
import { can } from "../../../../shared/roles";
import { PageHeader } from "../../../components/PageHeader";
import { Panel } from "../../../components/Panel";
import { LoadError, Loading } from "../../../components/QueryStatus";
import { useRequiredSession } from "../../../lib/session";
import { useMembers } from "../api/get-members";
import { useTeam } from "../api/get-team";
import { InviteForm } from "./InviteForm";
import { MembersTable } from "./MembersTable";
import { PendingInvitations } from "./PendingInvitations";

export function TeamPage() {
  const { teamId = "" } = useParams();
  const session = useRequiredSession();
  const team = useTeam(teamId);
  const members = useMembers(teamId);

  if (team.isPending) return <Loading />;
  if (team.isError) return <LoadError error={team.error} onRetry={() => void team.refetch()} />;

  const manager = can(team.data.role, "team:manage-members");
  return (
    <>
      <PageHeader
        context={team.data.name}
        title="Team"
        description={
          manager
            ? "Who works on this team's projects, and what each person may do."
            : "Who works on this team's projects. Admins and owners manage members and roles."
        }
      />
      <div className={manager ? "grid items-start gap-6 lg:grid-cols-[1fr_22rem]" : ""}>
        <Panel title="Members" titleId="team-members">
          {members.isPending && <Loading />}
          {members.isError && (
            <LoadError error={members.error} onRetry={() => void members.refetch()} />
          )}
          {members.data && (
            <MembersTable
              teamId={teamId}
              teamName={team.data.name}
              members={members.data}
              actorRole={team.data.role}
              actorId={session.user.id}
            />
          )}
        </Panel>
        {manager && (
          <div className="space-y-6">
            <Panel title="Invite someone" titleId="team-invite">
              <InviteForm teamId={teamId} actorRole={team.data.role} />
            </Panel>
            <Panel title="Pending invitations" titleId="team-pending">
              <PendingInvitations teamId={teamId} />
            </Panel>
          </div>
        )}
      </div>
    </>
  );
}
