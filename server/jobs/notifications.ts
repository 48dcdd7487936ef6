/**
 * News between Rillmark's processes through PostgreSQL LISTEN/NOTIFY: a web process hears that
 * the worker process finished a layer, the worker hears that a web process queued a job. One
 * listening connection per process (pg-listen: it reconnects and listens again after the
 * database restarts); notifications are sent on an ordinary pooled connection.
 *
 * NOTIFY is not stored: what is sent while a listener is reconnecting is lost. Listeners are
 * told about each reconnection (`onReconnect`) so they can read the state they were waiting on.
 */
import createSubscriber, { type Subscriber } from "pg-listen";

export interface Notifications {
  /** Calls `handler` with the payload of every notification on `channel`. */
  listen(channel: string, handler: (payload: unknown) => void): Promise<void>;
  /** Called after the listening connection was lost and made again (news may be missed). */
  onReconnect(handler: () => void): void;
  close(): Promise<void>;
}

export async function startNotifications(connectionString: string): Promise<Notifications> {
  const subscriber: Subscriber = createSubscriber(
    { connectionString },
    {
      // Keep trying for as long as it takes (the database may be restarting), twice a second.
      retryLimit: Infinity,
      retryTimeout: 0,
      retryInterval: 500,
      // A connection silently cut (no FIN) is noticed within 10 s.
      paranoidChecking: 10_000,
    },
  );
  const reconnectHandlers: (() => void)[] = [];
  const handlers: [string, (payload: unknown) => void][] = [];
  let connectedOnce = false;
  subscriber.events.on("connected", () => {
    if (connectedOnce) for (const handler of reconnectHandlers) handler();
    connectedOnce = true;
  });
  subscriber.events.on("error", (err: Error) => {
    console.error("Notification listener error:", err.message);
  });
  await subscriber.connect();
  return {
    async listen(channel, handler) {
      subscriber.notifications.on(channel, handler);
      handlers.push([channel, handler]);
      await subscriber.listenTo(channel);
    },
    onReconnect(handler) {
      reconnectHandlers.push(handler);
    },
    async close() {
      for (const [channel, handler] of handlers)
        subscriber.notifications.removeListener(channel, handler);
      // Already-ended clients (database gone) make end() reject; closing is best effort.
      await subscriber.close().catch(() => undefined);
    },
  };
}
