/**
 * Database work done for an HTTP request stops when its client goes away. Every connection the
 * pool hands out while a request runs is recorded against that request (AsyncLocalStorage);
 * when the request is abandoned, each such connection's running statement is cancelled with
 * pg_cancel_backend, and the request gets no new connection. A connection goes back to the
 * pool only once its cancel has been delivered, so a cancel can never reach the next borrower.
 * A cancel that arrives while the connection is idle is discarded by PostgreSQL.
 * See docs/decisions/008-database-time-limits.md.
 */
import { AsyncLocalStorage } from "node:async_hooks";
import pg from "pg";

/** Thrown instead of starting database work for a request whose client has gone. */
export class RequestGoneError extends Error {
  override name = "RequestGoneError";
  constructor() {
    super("The client went away; the request's database work was stopped.");
  }
}

/** pg sets it on connect (the backend's pid); @types/pg does not declare it. */
type BackendClient = pg.PoolClient & { processID: number | null };
type Release = (err?: Error | boolean) => void;
type ConnectCallback = (err: Error | undefined, client?: pg.PoolClient, done?: Release) => void;

interface Scope {
  readonly signal: AbortSignal;
  /** Connections this request holds right now, each with how to cancel its statement. */
  readonly held: Map<BackendClient, () => Promise<void>>;
  /** Cancels on their way; the connection is released after its cancel. */
  readonly cancels: Map<BackendClient, Promise<void>>;
}

const scopes = new AsyncLocalStorage<Scope>();

/** Runs `fn` (and everything it starts) as work for a request that `signal` aborts. */
export function runForRequest<T>(signal: AbortSignal, fn: () => T): T {
  const scope: Scope = { signal, held: new Map(), cancels: new Map() };
  signal.addEventListener("abort", () => {
    for (const [client, cancel] of scope.held) scope.cancels.set(client, cancel());
  });
  return scopes.run(scope, fn);
}

/** On a connection of its own: the pool may be full of the very statements to cancel. */
async function cancelBackend(target: pg.ClientConfig, client: BackendClient): Promise<void> {
  const pid = client.processID;
  if (pid === null) return;
  const canceller = new pg.Client({ ...target, statement_timeout: 5000 });
  try {
    await canceller.connect();
    await canceller.query("select pg_cancel_backend($1)", [pid]);
  } catch (err) {
    console.warn(
      `Could not cancel the statement of an abandoned request (backend ${pid}):`,
      err instanceof Error ? err.message : err,
    );
  } finally {
    await canceller.end().catch(() => undefined);
  }
}

/** Hands the connection to the request's scope: its release waits for a pending cancel. */
function adopt(scope: Scope, client: BackendClient, cancel: () => Promise<void>): void {
  scope.held.set(client, cancel);
  const release: Release = client.release.bind(client);
  client.release = (err?: Error | boolean) => {
    scope.held.delete(client);
    const pending = scope.cancels.get(client);
    if (!pending) return release(err);
    scope.cancels.delete(client);
    void pending.finally(() => release(err));
  };
}

/**
 * Makes `pool` record its connections against the current request. pg-pool's own `query`
 * goes through `connect`, so both single statements and transactions are covered.
 */
export function followRequests(pool: pg.Pool, target: pg.ClientConfig): void {
  const connect = pool.connect.bind(pool) as (cb: ConnectCallback) => void;
  const scoped = (cb?: ConnectCallback): Promise<pg.PoolClient> | undefined => {
    // The scope is read now, where the caller is: the callback may run in another request's
    // context (pg-pool hands a released connection straight to the next waiter).
    const scope = scopes.getStore();
    const run = (done: ConnectCallback) => {
      if (!scope) return connect(done);
      if (scope.signal.aborted) return process.nextTick(done, new RequestGoneError());
      connect((err, client) => {
        if (err || !client) return done(err);
        if (scope.signal.aborted) {
          client.release();
          return done(new RequestGoneError());
        }
        const backend = client as BackendClient;
        adopt(scope, backend, () => cancelBackend(target, backend));
        done(undefined, client, client.release);
      });
    };
    if (cb) return void run(cb);
    return new Promise((resolve, reject) => {
      run((err, client) => (err || !client ? reject(err) : resolve(client)));
    });
  };
  pool.connect = scoped as pg.Pool["connect"];
}
