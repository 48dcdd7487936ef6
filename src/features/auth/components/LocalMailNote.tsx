import { usePublicConfig } from "../../../lib/session";

/**
 * On a server whose mail stays local, a link sent to someone without an account (or who cannot
 * sign in) is readable only by whoever runs the server; say so rather than leave people waiting.
 */
export function LocalMailNote() {
  const config = usePublicConfig();
  if (!config.outboxEnabled) return null;
  return (
    <p className="mt-4 rounded-md bg-ink-50 px-3 py-2 text-sm text-ink-600">
      This server keeps mail instead of delivering it. Whoever runs it can read the message with{" "}
      <code className="text-ink-800">npm run outbox</code>.
    </p>
  );
}
