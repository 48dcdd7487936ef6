import { NavLink, useParams } from "react-router-dom";
import { Button } from "../../../components/Button";
import { PageHeader } from "../../../components/PageHeader";
import { LoadError, Loading } from "../../../components/QueryStatus";
import { formatDateTime } from "../../../lib/format";
import { useOutbox } from "../api/get-outbox";
import { MessageView } from "./MessageView";

const itemClass = ({ isActive }: { isActive: boolean }) =>
  `block rounded-md px-3 py-2.5 text-sm ${
    isActive ? "bg-rill-50 ring-1 ring-rill-300" : "hover:bg-ink-50"
  }`;

export function OutboxPage() {
  const { messageId } = useParams();
  const outbox = useOutbox();

  return (
    <>
      <PageHeader
        title="Outbox"
        description="Mail this development server kept instead of delivering: what was sent to you, and the invitations of teams you manage."
        actions={
          <Button
            variant="secondary"
            size="sm"
            pending={outbox.isFetching}
            onClick={() => void outbox.refetch()}
          >
            Check for new mail
          </Button>
        }
      />
      <div className="grid items-start gap-6 lg:grid-cols-[22rem_1fr]">
        <nav
          aria-label="Sent messages"
          className="rounded-lg border border-ink-200 bg-white p-2 shadow-xs"
        >
          {outbox.isPending && <Loading />}
          {outbox.isError && (
            <LoadError error={outbox.error} onRetry={() => void outbox.refetch()} />
          )}
          {outbox.data?.length === 0 && (
            <p className="px-3 py-6 text-center text-sm text-ink-500">No mail sent yet.</p>
          )}
          {outbox.data && outbox.data.length > 0 && (
            <ul className="space-y-1">
              {outbox.data.map((m) => (
                <li key={m.id}>
                  <NavLink to={`/outbox/${m.id}`} className={itemClass}>
                    <span className="block truncate font-medium text-ink-900">{m.subject}</span>
                    <span className="block truncate text-ink-500">to {m.to}</span>
                    <span className="block text-xs text-ink-400">
                      {formatDateTime(m.receivedAt)}
                    </span>
                  </NavLink>
                </li>
              ))}
            </ul>
          )}
        </nav>
        <section
          aria-label="Message"
          className="min-h-64 rounded-lg border border-ink-200 bg-white p-5 shadow-xs"
        >
          {messageId ? (
            <MessageView messageId={messageId} />
          ) : (
            <p className="py-16 text-center text-sm text-ink-500">Choose a message to read it.</p>
          )}
        </section>
      </div>
    </>
  );
}
