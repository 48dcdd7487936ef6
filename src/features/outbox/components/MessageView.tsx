import { LoadError, Loading } from "../../../components/QueryStatus";
import { formatDateTime } from "../../../lib/format";
import { useOutboxMessage } from "../api/get-outbox-message";
import { LinkifiedText } from "./LinkifiedText";

export function MessageView({ messageId }: { messageId: string }) {
  const message = useOutboxMessage(messageId);
  if (message.isPending) return <Loading />;
  if (message.isError) return <LoadError error={message.error} />;
  const m = message.data;
  return (
    <article aria-labelledby="outbox-subject">
      <header className="border-b border-ink-100 pb-3">
        <h2 id="outbox-subject" className="text-lg font-semibold text-ink-950">
          {m.subject}
        </h2>
        <dl className="mt-2 grid grid-cols-[4rem_1fr] gap-y-0.5 text-sm">
          <dt className="text-ink-500">From</dt>
          <dd className="text-ink-800">{m.from}</dd>
          <dt className="text-ink-500">To</dt>
          <dd className="text-ink-800">{m.to}</dd>
          <dt className="text-ink-500">Sent</dt>
          <dd className="text-ink-800">{formatDateTime(m.receivedAt)}</dd>
        </dl>
      </header>
      <div className="pt-4">
        <LinkifiedText text={m.text} />
      </div>
    </article>
  );
}
