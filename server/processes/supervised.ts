/**
 * One child process of the supervisor, kept running: started (app processes through Node's
 * cluster module, so they share one port; the others with child_process.fork), awaited until it
 * says "ready", started again after an unexpected exit (sooner after a long life, later after
 * a quick death, so a crash loop does not spin), and stopped on request.
 */
import { fork, type ChildProcess } from "node:child_process";
import cluster from "node:cluster";
import { fileURLToPath } from "node:url";
import type { FromChild, ProcessRole, ToChild } from "./messages";

const ENTRY = fileURLToPath(new URL("./entry.ts", import.meta.url));
const STOP_GRACE_MS = 15_000;
const MAX_BACKOFF_MS = 30_000;

type Ready = Extract<FromChild, { type: "ready" }>;

export class Supervised {
  private child: ChildProcess | undefined;
  private stopping = false;
  private backoffMs = 500;
  /** Called with each new child before it is awaited (the stand-ins get their orders so). */
  onSpawn: (child: ChildProcess) => void = () => undefined;
  /** Called after a restarted child is ready. */
  onRestarted: (ready: Ready) => void = () => undefined;

  constructor(
    readonly role: ProcessRole,
    private readonly env: () => NodeJS.ProcessEnv,
  ) {}

  get pid(): number | undefined {
    return this.child?.pid;
  }

  private spawn(): ChildProcess {
    if (this.role === "web") {
      cluster.setupPrimary({ exec: ENTRY, args: ["web"], execArgv: process.execArgv });
      return cluster.fork(this.env()).process;
    }
    return fork(ENTRY, [this.role], { env: this.env(), execArgv: process.execArgv });
  }

  /** Starts the child and resolves once it is ready (rejects if it fails to start). */
  start(): Promise<Ready> {
    const child = this.spawn();
    this.child = child;
    const startedAt = Date.now();
    this.onSpawn(child);
    const ready = new Promise<Ready>((resolve, reject) => {
      const onMessage = (message: FromChild) => {
        if (message.type === "ready") resolve(message);
        if (message.type === "failed") reject(new Error(message.message));
      };
      child.on("message", onMessage);
      child.once("exit", (code, signal) =>
        reject(new Error(`the ${this.role} process stopped (${signal ?? `exit ${code}`})`)),
      );
    });
    child.once("exit", (code, signal) => {
      if (this.stopping || this.child !== child) return;
      const lived = Date.now() - startedAt;
      // Died while starting: likely to again (a bad setting), so wait longer each time.
      this.backoffMs = lived > 10_000 ? 500 : Math.min(this.backoffMs * 2, MAX_BACKOFF_MS);
      console.warn(
        `The ${this.role} process ${child.pid} stopped (${signal ?? `exit ${code}`}); ` +
          `starting another in ${this.backoffMs / 1000} s.`,
      );
      setTimeout(() => this.restart(), this.backoffMs).unref();
    });
    return ready;
  }

  private restart(): void {
    if (this.stopping) return;
    this.start().then(
      (ready) => this.onRestarted(ready),
      (err: unknown) =>
        console.error(
          `The ${this.role} process stopped before it was ready:`,
          (err as Error).message,
        ),
    );
  }

  /** Asks the child to stop, and kills it if it has not after the grace time. */
  async stop(): Promise<void> {
    this.stopping = true;
    const child = this.child;
    if (!child || child.exitCode !== null || child.signalCode !== null) return;
    const exited = new Promise<void>((resolve) => child.once("exit", () => resolve()));
    if (child.connected) child.send({ type: "stop" } satisfies ToChild);
    else child.kill("SIGTERM");
    const timer = setTimeout(() => child.kill("SIGKILL"), STOP_GRACE_MS);
    await exited;
    clearTimeout(timer);
  }
}
