/**
 * A small client of Rillmark's own HTTP API, signed in as one person, for the demo seed: the
 * demo's files go through exactly the routes a user's browser calls (uploads, mappings, rules,
 * compute), with their validation, permissions and transactions, instead of a second path into
 * the database.
 */
import { readFile } from "node:fs/promises";
import path from "node:path";
import { SESSION_COOKIE } from "../auth/session";

export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly body: unknown,
    what: string,
  ) {
    const detail =
      typeof body === "object" && body !== null && "error" in body
        ? JSON.stringify((body as { error: unknown }).error)
        : String(body);
    super(`${what} answered ${status}: ${detail}`);
    this.name = "ApiError";
  }
}

export interface ApiResponse<T> {
  readonly status: number;
  readonly body: T;
}

export class ApiClient {
  private constructor(
    private readonly baseUrl: string,
    private readonly cookie: string,
    readonly who: string,
  ) {}

  /** Signs in with e-mail and password; throws ApiError when the API refuses. */
  static async signIn(baseUrl: string, email: string, password: string): Promise<ApiClient> {
    const res = await fetch(`${baseUrl}/api/auth/sign-in`, {
      method: "POST",
      headers: { "Content-Type": "application/json" },
      body: JSON.stringify({ email, password }),
    });
    const body: unknown = await res.json().catch(() => null);
    if (res.status !== 200) throw new ApiError(res.status, body, `signing in as ${email}`);
    const cookie = res.headers
      .getSetCookie()
      .map((c) => c.split(";")[0] ?? "")
      .find((c) => c.startsWith(`${SESSION_COOKIE}=`));
    if (!cookie) throw new Error(`signing in as ${email} set no session cookie`);
    return new ApiClient(baseUrl, cookie, email);
  }

  private async send<T>(method: string, route: string, init: RequestInit): Promise<ApiResponse<T>> {
    const res = await fetch(`${this.baseUrl}/api${route}`, {
      ...init,
      method,
      headers: { ...init.headers, Cookie: this.cookie },
    });
    const text = await res.text();
    const body = (text === "" ? null : JSON.parse(text)) as T;
    if (res.status >= 400) throw new ApiError(res.status, body, `${method} ${route}`);
    return { status: res.status, body };
  }

  /** The session cookie, as a Cookie header value (load tests send it from their own client). */
  get cookieHeader(): string {
    return this.cookie;
  }

  get<T>(route: string): Promise<T> {
    return this.send<T>("GET", route, {}).then((r) => r.body);
  }

  /** A JSON request; answers the parsed body (null for 204). */
  async json<T>(method: "POST" | "PUT" | "PATCH" | "DELETE", route: string, body?: unknown) {
    const init: RequestInit =
      body === undefined
        ? {}
        : { headers: { "Content-Type": "application/json" }, body: JSON.stringify(body) };
    return (await this.send<T>(method, route, init)).body;
  }

  /** A multipart upload of one file (field "file") with text fields, as the browser sends it. */
  async upload<T>(
    route: string,
    filePath: string,
    fields: Readonly<Record<string, string>>,
  ): Promise<ApiResponse<T>> {
    const form = new FormData();
    for (const [key, value] of Object.entries(fields)) form.append(key, value);
    form.append("file", new Blob([await readFile(filePath)]), path.basename(filePath));
    return this.send<T>("POST", route, { body: form });
  }
}
