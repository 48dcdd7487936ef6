const KEY = "rillmark.lastTeam";

/** The team last worked in, so pages without a team in the URL (Account, Outbox) keep it. */
export function readLastTeam(): string | null {
  try {
    return window.localStorage.getItem(KEY);
  } catch {
    return null;
  }
}

export function rememberTeam(teamId: string): void {
  try {
    window.localStorage.setItem(KEY, teamId);
  } catch {
    // Private mode or storage full: the team switcher still works, it just forgets.
  }
}
