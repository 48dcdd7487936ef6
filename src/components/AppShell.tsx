import { type ReactNode } from "react";
import { Link, NavLink, useLocation } from "react-router-dom";
import { type Membership } from "../../shared/schemas/auth";
import { AccountMenu } from "./AccountMenu";
import { Caution } from "./Caution";
import { Wordmark } from "./Logo";

interface AppShellProps {
  user: { name: string; email: string };
  memberships: readonly Membership[];
  currentTeamId: string | undefined;
  onTeamChange: (teamId: string) => void;
  showOutbox: boolean;
  onSignOut: () => void;
  signingOut: boolean;
  children: ReactNode;
}

const navClass = (isActive: boolean) =>
  `rounded-md px-3 py-1.5 text-sm font-medium focus-visible:outline-rill-300 ${
    isActive ? "bg-ink-800 text-white" : "text-ink-200 hover:bg-ink-800 hover:text-white"
  }`;

function TeamSwitcher({
  memberships,
  currentTeamId,
  onTeamChange,
}: Pick<AppShellProps, "memberships" | "currentTeamId" | "onTeamChange">) {
  if (memberships.length === 0) return null;
  if (memberships.length === 1) {
    return (
      <span className="max-w-64 truncate text-sm text-ink-200">{memberships[0]!.teamName}</span>
    );
  }
  return (
    <div>
      <label htmlFor="team-switcher" className="sr-only">
        Team
      </label>
      <select
        id="team-switcher"
        value={currentTeamId}
        onChange={(event) => onTeamChange(event.target.value)}
        className="max-w-64 rounded-md border border-ink-700 bg-ink-800 py-1.5 pr-7 pl-2 text-sm text-ink-100 focus-visible:outline-rill-300"
      >
        {memberships.map((m) => (
          <option key={m.teamId} value={m.teamId}>
            {m.teamName}
          </option>
        ))}
      </select>
    </div>
  );
}

/** The frame of every signed-in page: top bar, main content, caution footer. */
export function AppShell({
  user,
  memberships,
  currentTeamId,
  onTeamChange,
  showOutbox,
  onSignOut,
  signingOut,
  children,
}: AppShellProps) {
  // A project's own page belongs under Projects, though its address has no team in it.
  const onProjectPage = useLocation().pathname.startsWith("/projects/");
  return (
    <div className="flex min-h-screen flex-col">
      <a
        href="#main"
        className="sr-only z-50 rounded-md bg-white px-3 py-2 text-sm focus:not-sr-only focus:fixed focus:top-2 focus:left-2"
      >
        Skip to content
      </a>
      <header className="bg-ink-900 text-white">
        <div className="mx-auto flex h-14 max-w-page items-center gap-5 px-6">
          <Link
            to="/"
            className="rounded-md focus-visible:outline-rill-300"
            aria-label="Rillmark home"
          >
            <Wordmark tone="light" />
          </Link>
          <span aria-hidden="true" className="h-6 w-px bg-ink-700" />
          <TeamSwitcher
            memberships={memberships}
            currentTeamId={currentTeamId}
            onTeamChange={onTeamChange}
          />
          <nav aria-label="Main" className="flex items-center gap-1">
            {currentTeamId && (
              <>
                <NavLink
                  to={`/teams/${currentTeamId}/projects`}
                  className={({ isActive }) => navClass(isActive || onProjectPage)}
                >
                  Projects
                </NavLink>
                <NavLink
                  to={`/teams/${currentTeamId}/members`}
                  className={({ isActive }) => navClass(isActive)}
                >
                  Team
                </NavLink>
                <NavLink
                  to={`/teams/${currentTeamId}/catalog`}
                  className={({ isActive }) => navClass(isActive)}
                >
                  Surface catalog
                </NavLink>
              </>
            )}
            {showOutbox && (
              <NavLink to="/outbox" className={({ isActive }) => navClass(isActive)}>
                Outbox
              </NavLink>
            )}
          </nav>
          <div className="ml-auto">
            <AccountMenu
              name={user.name}
              email={user.email}
              onSignOut={onSignOut}
              signingOut={signingOut}
            />
          </div>
        </div>
      </header>
      <main id="main" tabIndex={-1} className="mx-auto w-full max-w-page flex-1 px-6 py-8">
        {children}
      </main>
      <footer className="mx-auto w-full max-w-page px-6 pb-6">
        <Caution />
      </footer>
    </div>
  );
}
