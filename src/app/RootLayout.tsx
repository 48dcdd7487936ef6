import { type ReactNode } from "react";
import { Outlet, ScrollRestoration, useNavigation } from "react-router-dom";
import { Button } from "../components/Button";
import { Wordmark } from "../components/Logo";
import { errorMessage } from "../components/QueryStatus";
import { useConfig } from "../features/auth/api/get-config";
import { useMe } from "../features/auth/api/get-me";
import { AppContextProvider } from "../lib/session";

export function FullPageStatus({ children }: { children?: ReactNode }) {
  return (
    <div className="grid min-h-screen place-items-center p-6">
      <div className="flex flex-col items-center gap-4 text-center">
        <Wordmark />
        {children ?? (
          <p role="status" className="text-sm text-ink-500">
            Loading…
          </p>
        )}
      </div>
    </div>
  );
}

/** A thin bar while the next page's code or data is on its way. */
function NavigationProgress() {
  const navigation = useNavigation();
  if (navigation.state === "idle") return null;
  return (
    <div
      aria-hidden="true"
      className="fixed inset-x-0 top-0 z-50 h-0.5 animate-pulse bg-rill-400"
    />
  );
}

/** Loads the server config and the session once, then provides both to every page. */
export function RootLayout() {
  const config = useConfig();
  const me = useMe();

  if (config.isPending || me.isPending) return <FullPageStatus />;
  if (config.isError || me.isError) {
    return (
      <FullPageStatus>
        <p role="alert" className="max-w-sm text-sm text-brick-700">
          {errorMessage(config.error ?? me.error)}
        </p>
        <Button
          variant="secondary"
          onClick={() => {
            void config.refetch();
            void me.refetch();
          }}
        >
          Try again
        </Button>
      </FullPageStatus>
    );
  }
  return (
    <AppContextProvider value={{ session: me.data, config: config.data }}>
      <NavigationProgress />
      <Outlet />
      <ScrollRestoration />
    </AppContextProvider>
  );
}
