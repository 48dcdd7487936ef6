import { type z } from "zod";
import { apiErrorSchema } from "../../shared/schemas/common";

/** A failed API call, carrying the server's error code, message and per-field messages. */
export class ApiError extends Error {
  readonly status: number;
  readonly code: string;
  readonly fields: Record<string, string>;

  constructor(status: number, code: string, message: string, fields: Record<string, string> = {}) {
    super(message);
    this.name = "ApiError";
    this.status = status;
    this.code = code;
    this.fields = fields;
  }
}

export function isApiError(error: unknown, status?: number): error is ApiError {
  return error instanceof ApiError && (status === undefined || error.status === status);
}

type Method = "GET" | "POST" | "PATCH" | "PUT" | "DELETE";

interface RequestOptions {
  method?: Method;
  body?: unknown;
  signal?: AbortSignal;
}

async function send(path: string, { method = "GET", body, signal }: RequestOptions) {
  let response: Response;
  try {
    response = await fetch(path, {
      method,
      credentials: "same-origin",
      headers: {
        Accept: "application/json",
        ...(body === undefined ? {} : { "Content-Type": "application/json" }),
      },
      body: body === undefined ? undefined : JSON.stringify(body),
      signal,
    });
  } catch (error) {
    if (signal?.aborted) throw error;
    throw new ApiError(
      0,
      "network",
      "Rillmark's server could not be reached. Check the connection and try again.",
    );
  }
  if (!response.ok) throw await errorFrom(response);
  return response;
}

async function errorFrom(response: Response): Promise<ApiError> {
  const payload: unknown = await response.json().catch(() => null);
  const parsed = apiErrorSchema.safeParse(payload);
  if (parsed.success) {
    const { code, message, fields } = parsed.data.error;
    return new ApiError(response.status, code, message, fields);
  }
  return new ApiError(
    response.status,
    "http_error",
    `The server answered with status ${response.status}. Try again in a moment.`,
  );
}

async function parseBody<T>(response: Response, schema: z.ZodType<T>): Promise<T> {
  const payload: unknown = await response.json().catch(() => undefined);
  const parsed = schema.safeParse(payload);
  if (!parsed.success) {
    // The server broke the shared contract; say so rather than render half-valid data.
    throw new ApiError(
      response.status,
      "bad_response",
      "The server sent an answer this page cannot read. Reload the page; if it persists, tell your administrator.",
    );
  }
  return parsed.data;
}

/** GET a JSON resource and check it against its shared schema. */
export async function apiGet<T>(path: string, schema: z.ZodType<T>, signal?: AbortSignal) {
  return parseBody(await send(path, { signal }), schema);
}

/** A state-changing request whose answer is JSON checked against `schema`. */
export async function apiSend<T>(
  method: Exclude<Method, "GET">,
  path: string,
  schema: z.ZodType<T>,
  body?: unknown,
): Promise<T> {
  return parseBody(await send(path, { method, body }), schema);
}

/** A state-changing request that answers 204 No Content (or whose body is not needed). */
export async function apiSendEmpty(
  method: Exclude<Method, "GET">,
  path: string,
  body?: unknown,
): Promise<void> {
  await send(path, { method, body });
}

/** Builds an API path with every dynamic segment encoded. */
export function apiPath(strings: TemplateStringsArray, ...values: string[]): string {
  return strings.reduce(
    (path, part, i) => path + part + (i < values.length ? encodeURIComponent(values[i]!) : ""),
    "",
  );
}
