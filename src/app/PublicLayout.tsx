import { Outlet } from "react-router-dom";
import { AuthFrame } from "../components/AuthFrame";
import { useSignOut } from "../features/auth/api/sign-out";
import { useSession } from "../lib/session";

/** Shows who is signed in on public pages (e.g. an invitation meant for another address). */
function SessionNote() {
  const session = useSession();
  const signOut = useSignOut();
  if (!session) return null;
  return (
    <p className="text-sm text-ink-600">
      Signed in as <span className="font-medium text-ink-800">{session.user.email}</span> ·{" "}
      <button
        type="button"
        className="font-medium text-rill-700 underline underline-offset-2 hover:text-rill-800"
        disabled={signOut.isPending}
        onClick={() => signOut.mutate()}
      >
        Sign out
      </button>
    </p>
  );
}

export function PublicLayout() {
  return (
    <AuthFrame aside={<SessionNote />}>
      <Outlet />
    </AuthFrame>
  );
}
