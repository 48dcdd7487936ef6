import { ROLE_LABELS } from "../../../../shared/roles";
import { Button } from "../../../components/Button";
import { FormError } from "../../../components/FormError";
import { LoadError, Loading } from "../../../components/QueryStatus";
import { isApiError } from "../../../lib/api";
import { formatDate } from "../../../lib/format";
import { useInvitations } from "../api/get-invitations";
import { useRevokeInvitation } from "../api/revoke-invitation";

export function PendingInvitations({ teamId }: { teamId: string }) {
  const invitations = useInvitations(teamId);
  const revoke = useRevokeInvitation(teamId);

  if (invitations.isPending) return <Loading />;
  if (invitations.isError) {
    return <LoadError error={invitations.error} onRetry={() => void invitations.refetch()} />;
  }
  if (invitations.data.length === 0) {
    return <p className="text-sm text-ink-600">No invitations waiting for an answer.</p>;
  }
  return (
    <div className="space-y-3">
      <FormError message={isApiError(revoke.error) ? revoke.error.message : null} />
      <ul className="divide-y divide-ink-100 text-sm">
        {invitations.data.map((inv) => (
          <li key={inv.id} className="flex items-start justify-between gap-3 py-2.5">
            <div className="min-w-0">
              <p className="truncate font-medium text-ink-900">{inv.email}</p>
              <p className="text-ink-500">
                {ROLE_LABELS[inv.role]} · invited by {inv.invitedBy} · open until{" "}
                {formatDate(inv.expiresAt)}
              </p>
            </div>
            <Button
              variant="quiet"
              size="sm"
              aria-label={`Revoke the invitation for ${inv.email}`}
              pending={revoke.isPending && revoke.variables === inv.id}
              onClick={() => revoke.mutate(inv.id)}
            >
              Revoke
            </Button>
          </li>
        ))}
      </ul>
    </div>
  );
}
