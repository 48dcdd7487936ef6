import { useState } from "react";
import { canAssignRole, ROLE_LABELS, ROLES, type Role } from "../../../../shared/roles";
import { type Member } from "../../../../shared/schemas/team";
import { Button } from "../../../components/Button";
import { ConfirmDialog } from "../../../components/ConfirmDialog";
import { Select } from "../../../components/Select";
import { TableHead } from "../../../components/TableHead";
import { isApiError } from "../../../lib/api";
import { formatDate } from "../../../lib/format";
import { useChangeRole } from "../api/change-role";
import { useRemoveMember } from "../api/remove-member";

interface MembersTableProps {
  teamId: string;
  teamName: string;
  members: readonly Member[];
  actorRole: Role;
  actorId: string;
}

function RoleCell({
  teamId,
  member,
  actorRole,
}: {
  teamId: string;
  member: Member;
  actorRole: Role;
}) {
  const change = useChangeRole(teamId);
  if (!canAssignRole(actorRole, member.role)) {
    return <span className="text-ink-700">{ROLE_LABELS[member.role]}</span>;
  }
  const options = ROLES.filter((r) => canAssignRole(actorRole, r)).map((r) => ({
    value: r,
    label: ROLE_LABELS[r],
  }));
  return (
    <Select
      label={`Role of ${member.name}`}
      hideLabel
      name="role"
      options={options}
      value={member.role}
      disabled={change.isPending}
      error={isApiError(change.error) ? change.error.message : undefined}
      onChange={(event) =>
        change.mutate({ userId: member.userId, role: event.target.value as Role })
      }
      className="w-44"
    />
  );
}

const MEMBER_COLUMNS = [
  { label: "Name" },
  { label: "Role" },
  { label: "Joined" },
  { label: "Actions", hidden: true },
];

export function MembersTable({ teamId, teamName, members, actorRole, actorId }: MembersTableProps) {
  const remove = useRemoveMember(teamId);
  const [leaving, setLeaving] = useState<Member | null>(null);

  return (
    <>
      <table className="w-full text-left text-sm">
        <caption className="sr-only">Members of {teamName}</caption>
        <TableHead columns={MEMBER_COLUMNS} />
        <tbody className="divide-y divide-ink-100">
          {members.map((member) => {
            const self = member.userId === actorId;
            return (
              <tr key={member.userId} className="align-top">
                <td className="py-3 pr-4">
                  <span className="font-medium text-ink-900">{member.name}</span>
                  {self && <span className="ml-1.5 text-xs text-ink-500">(you)</span>}
                  <span className="block text-ink-500">{member.email}</span>
                </td>
                <td className="py-2 pr-4">
                  <RoleCell teamId={teamId} member={member} actorRole={actorRole} />
                </td>
                <td className="py-3 pr-4 whitespace-nowrap text-ink-600">
                  {formatDate(member.joinedAt)}
                </td>
                <td className="py-2 text-right">
                  {!self && canAssignRole(actorRole, member.role) && (
                    <Button
                      variant="quiet"
                      size="sm"
                      aria-label={`Remove ${member.name} from the team`}
                      onClick={() => {
                        remove.reset();
                        setLeaving(member);
                      }}
                    >
                      Remove
                    </Button>
                  )}
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>
      <ConfirmDialog
        open={leaving !== null}
        title={`Remove ${leaving?.name ?? ""} from ${teamName}?`}
        confirmLabel="Remove from team"
        pending={remove.isPending}
        error={isApiError(remove.error) ? remove.error.message : null}
        onClose={() => setLeaving(null)}
        onConfirm={() => {
          if (leaving) remove.mutate(leaving.userId, { onSuccess: () => setLeaving(null) });
        }}
      >
        They lose access to the team's projects at once. Their past work and sign-offs stay on
        record. You can invite them again later.
      </ConfirmDialog>
    </>
  );
}
