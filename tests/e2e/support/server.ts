import { existsSync } from "node:fs";
import path from "node:path";
import { startRillmark, type RunningRillmark } from "../../../server/main";

/**
 * Rillmark in this process on a free loopback port: it migrates, seeds the demo once, starts
 * its local mail server and serves the built client from dist/client.
 */
export async function startServer(): Promise<RunningRillmark> {
  const index = path.resolve("dist/client/index.html");
  if (!existsSync(index)) {
    throw new Error(
      `No built client at ${index}. Run \`npx vite build\` first (npm test builds it for you).`,
    );
  }
  const running = await startRillmark({ port: 0 });
  if (!new URL(running.url).hostname.startsWith("127.0.0.1")) {
    await running.close();
    throw new Error(`The test server must listen on 127.0.0.1, not ${running.url}`);
  }
  return running;
}
