import net from "node:net";

/**
 * A TCP relay in front of the test database, so a test can cut the database off from one app
 * (a real outage: connections drop and new ones fail) and bring it back.
 */
export interface DbProxy {
  /** DATABASE_URL with the relay's port. */
  url: string;
  cut(): void;
  restore(): void;
  close(): Promise<void>;
}

export async function startDbProxy(databaseUrl: string): Promise<DbProxy> {
  const target = new URL(databaseUrl);
  const sockets = new Set<net.Socket>();
  let down = false;
  const server = net.createServer((client) => {
    if (down) {
      client.destroy();
      return;
    }
    const upstream = net.connect(Number(target.port || 5432), target.hostname);
    for (const s of [client, upstream]) {
      sockets.add(s);
      s.on("close", () => sockets.delete(s));
      s.on("error", () => {
        client.destroy();
        upstream.destroy();
      });
    }
    client.pipe(upstream).pipe(client);
  });
  await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", resolve));
  const url = new URL(databaseUrl);
  url.hostname = "127.0.0.1";
  url.port = String((server.address() as net.AddressInfo).port);
  return {
    url: url.toString(),
    cut() {
      down = true;
      for (const s of sockets) s.destroy();
    },
    restore() {
      down = false;
    },
    close: () =>
      new Promise<void>((resolve) => {
        for (const s of sockets) s.destroy();
        server.close(() => resolve());
      }),
  };
}
