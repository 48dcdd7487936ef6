import { useEffect, useRef } from "react";
import { Link, useNavigate, useParams } from "react-router-dom";
import { AuthCard } from "../../../components/AuthFrame";
import { FormError } from "../../../components/FormError";
import { linkClass } from "../../../components/link-styles";
import { Loading } from "../../../components/QueryStatus";
import { isApiError } from "../../../lib/api";
import { useConfirmEmail } from "../api/confirm-email";

export function ConfirmEmailPage() {
  const { token = "" } = useParams();
  const navigate = useNavigate();
  const confirm = useConfirmEmail();
  const started = useRef(false);
  const { mutate } = confirm;

  // The link is single use: send it once, even when React mounts the page twice in dev.
  useEffect(() => {
    if (started.current) return;
    started.current = true;
    mutate(token, {
      onSuccess: (session) => {
        const owned = session.memberships.find((m) => m.role === "owner");
        const teamId = owned?.teamId ?? session.memberships[0]?.teamId;
        navigate(teamId ? `/teams/${teamId}/projects` : "/", { replace: true });
      },
    });
  }, [mutate, navigate, token]);

  if (confirm.isError) {
    const expired = isApiError(confirm.error, 410);
    return (
      <AuthCard title={expired ? "This link has already done its job" : "We could not confirm"}>
        <FormError
          message={
            expired
              ? "The confirmation link has expired or was already used. If you confirmed before, sign in; otherwise sign up again for a fresh link."
              : isApiError(confirm.error, 404) || isApiError(confirm.error, 422)
                ? "This confirmation link is not valid. Check that the whole link from the e-mail was opened."
                : isApiError(confirm.error)
                  ? confirm.error.message
                  : "Something went wrong. Try the link again."
          }
        />
        <p className="mt-4 flex gap-4 text-sm">
          <Link to="/sign-in" className={linkClass}>
            Sign in
          </Link>
          <Link to="/sign-up" className={linkClass}>
            Sign up again
          </Link>
        </p>
      </AuthCard>
    );
  }

  return (
    <AuthCard title="Confirming your e-mail address">
      <Loading label="Setting up your account and your team…" />
    </AuthCard>
  );
}
