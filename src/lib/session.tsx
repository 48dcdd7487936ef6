import { createContext, useContext, type ReactNode } from "react";
import { type Membership, type PublicConfig, type SessionInfo } from "../../shared/schemas/auth";

interface AppContextValue {
  session: SessionInfo | null;
  config: PublicConfig;
}

const AppContext = createContext<AppContextValue | null>(null);

/** Provided once by the root route from the session and config queries. */
export function AppContextProvider({
  value,
  children,
}: {
  value: AppContextValue;
  children: ReactNode;
}) {
  return <AppContext.Provider value={value}>{children}</AppContext.Provider>;
}

function useAppContext(): AppContextValue {
  const value = useContext(AppContext);
  if (!value) throw new Error("useAppContext outside AppContextProvider");
  return value;
}

export function usePublicConfig(): PublicConfig {
  return useAppContext().config;
}

export function useSession(): SessionInfo | null {
  return useAppContext().session;
}

/** For pages under the signed-in layout, which never renders without a session. */
export function useRequiredSession(): SessionInfo {
  const session = useSession();
  if (!session) throw new Error("useRequiredSession on a page outside the signed-in layout");
  return session;
}

export function useMembership(teamId: string | undefined): Membership | undefined {
  const session = useSession();
  return session?.memberships.find((m) => m.teamId === teamId);
}
