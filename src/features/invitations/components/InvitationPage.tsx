import { Link, useNavigate, useParams } from "react-router-dom";
import { ROLE_DESCRIPTIONS, ROLE_LABELS } from "../../../../shared/roles";
import { type InvitationPreview, type SessionInfo } from "../../../../shared/schemas/auth";
import { AuthCard } from "../../../components/AuthFrame";
import { Button, buttonClass } from "../../../components/Button";
import { FormError } from "../../../components/FormError";
import { Loading } from "../../../components/QueryStatus";
import { isApiError } from "../../../lib/api";
import { signInPath } from "../../../lib/navigation";
import { useSession } from "../../../lib/session";
import { useAcceptInvitation } from "../api/accept-invitation";
import { useInvitation } from "../api/get-invitation";
import { NewAccountForm } from "./NewAccountForm";

function InvitationDetails({ preview }: { preview: InvitationPreview }) {
  return (
    <dl className="mb-6 grid grid-cols-[7rem_1fr] gap-x-3 gap-y-2 rounded-lg bg-ink-50 p-4 text-sm">
      <dt className="text-ink-500">Team</dt>
      <dd className="font-medium text-ink-900">{preview.teamName}</dd>
      <dt className="text-ink-500">Your role</dt>
      <dd>
        <span className="font-medium text-ink-900">{ROLE_LABELS[preview.role]}</span>
        <span className="block text-ink-600">{ROLE_DESCRIPTIONS[preview.role]}</span>
      </dd>
      <dt className="text-ink-500">Invited by</dt>
      <dd className="text-ink-900">{preview.invitedBy}</dd>
      <dt className="text-ink-500">For</dt>
      <dd className="break-all text-ink-900">{preview.email}</dd>
    </dl>
  );
}

function ExistingAccountJoin({
  token,
  preview,
  onJoined,
}: {
  token: string;
  preview: InvitationPreview;
  onJoined: (session: SessionInfo) => void;
}) {
  const session = useSession();
  const accept = useAcceptInvitation(token);
  const here = `/invitations/${token}`;

  if (!session) {
    return (
      <div className="space-y-3 text-sm text-ink-700">
        <p>{preview.email} already has a Rillmark account. Sign in with it to join the team.</p>
        <Link to={signInPath(here, preview.email)} className={`${buttonClass()} w-full`}>
          Sign in to accept
        </Link>
      </div>
    );
  }
  if (session.user.email.toLowerCase() !== preview.email.toLowerCase()) {
    return (
      <FormError
        message={`This invitation is for ${preview.email}, but you are signed in as ${session.user.email}. Sign out (top right), then open this link again.`}
      />
    );
  }
  return (
    <div className="space-y-3">
      <FormError message={isApiError(accept.error) ? accept.error.message : null} />
      <Button
        className="w-full"
        pending={accept.isPending}
        onClick={() => accept.mutate({}, { onSuccess: onJoined })}
      >
        Join {preview.teamName}
      </Button>
    </div>
  );
}

export function InvitationPage() {
  const { token = "" } = useParams();
  const navigate = useNavigate();
  const invitation = useInvitation(token);
  const session = useSession();

  if (invitation.isPending) {
    return (
      <AuthCard title="Opening your invitation">
        <Loading />
      </AuthCard>
    );
  }
  if (invitation.isError) {
    const gone = isApiError(invitation.error, 410);
    return (
      <AuthCard title={gone ? "This invitation is no longer open" : "Invitation not found"}>
        <p className="text-sm text-ink-700">
          {gone
            ? "It has expired or was already used. Ask the person who invited you to send a new one."
            : "The link may be incomplete or the invitation was withdrawn. Check the link in the e-mail, or ask for a new invitation."}
        </p>
      </AuthCard>
    );
  }

  const preview = invitation.data;
  const onJoined = (joinedAs: SessionInfo) => {
    const joined = joinedAs.memberships.findLast((m) => m.teamName === preview.teamName);
    navigate(joined ? `/teams/${joined.teamId}/projects` : "/", { replace: true });
  };

  return (
    <AuthCard title={`Join ${preview.teamName} on Rillmark`}>
      <InvitationDetails preview={preview} />
      {preview.accountExists ? (
        <ExistingAccountJoin token={token} preview={preview} onJoined={onJoined} />
      ) : (
        <>
          {session && (
            <p className="mb-4 text-sm text-ink-600">
              You are signed in as {session.user.email}. Creating this account signs you in as{" "}
              {preview.email} instead.
            </p>
          )}
          <NewAccountForm
            token={token}
            email={preview.email}
            teamName={preview.teamName}
            onJoined={onJoined}
          />
        </>
      )}
    </AuthCard>
  );
}
