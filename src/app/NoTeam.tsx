import { Link } from "react-router-dom";
import { linkClass } from "../components/link-styles";
import { PageHeader } from "../components/PageHeader";

export function NoTeam() {
  return (
    <>
      <PageHeader title="You're not in a team yet" />
      <p className="max-w-xl text-sm text-ink-700">
        Projects belong to teams. When an admin invites you, the e-mail's link adds you to their
        team and its projects appear here. Your{" "}
        <Link to="/account" className={linkClass}>
          account settings
        </Link>{" "}
        stay available meanwhile.
      </p>
    </>
  );
}
