import { Link } from "react-router-dom";
import { ROLE_LABELS } from "../../../../shared/roles";
import { linkClass } from "../../../components/link-styles";
import { PageHeader } from "../../../components/PageHeader";
import { Panel } from "../../../components/Panel";
import { LoadError, Loading } from "../../../components/QueryStatus";
import { useAccount } from "../api/get-account";
import { PasswordForm } from "./PasswordForm";
import { ProfileForm } from "./ProfileForm";

export function AccountPage() {
  const account = useAccount();

  return (
    <>
      <PageHeader
        title="Account"
        description="Your name, your password and the teams you belong to."
      />
      {account.isPending && <Loading />}
      {account.isError && (
        <LoadError error={account.error} onRetry={() => void account.refetch()} />
      )}
      {account.data && (
        <div className="grid gap-6 lg:grid-cols-2">
          <Panel title="Profile" titleId="account-profile">
            <ProfileForm account={account.data} />
          </Panel>
          <Panel title="Password" titleId="account-password">
            <PasswordForm />
          </Panel>
          <Panel title="Teams" titleId="account-teams" className="lg:col-span-2">
            {account.data.memberships.length === 0 ? (
              <p className="text-sm text-ink-600">
                You are not in any team right now. An invitation e-mail from a team admin brings you
                in.
              </p>
            ) : (
              <ul className="divide-y divide-ink-100 text-sm">
                {account.data.memberships.map((m) => (
                  <li key={m.teamId} className="flex items-center justify-between py-2.5">
                    <Link to={`/teams/${m.teamId}/projects`} className={linkClass}>
                      {m.teamName}
                    </Link>
                    <span className="text-ink-600">{ROLE_LABELS[m.role]}</span>
                  </li>
                ))}
              </ul>
            )}
          </Panel>
        </div>
      )}
    </>
  );
}
