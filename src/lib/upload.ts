import { type z } from "zod";
import { apiErrorSchema } from "../../shared/schemas/common";
import { ApiError } from "./api";

export interface UploadProgress {
  loadedBytes: number;
  totalBytes: number;
}

export interface UploadResult<T> {
  status: number;
  body: T;
}

function errorOf(status: number, text: string): ApiError {
  let payload: unknown = null;
  try {
    payload = JSON.parse(text);
  } catch {
    // not JSON: fall through to the generic message
  }
  const parsed = apiErrorSchema.safeParse(payload);
  if (parsed.success) {
    const { code, message, fields } = parsed.data.error;
    return new ApiError(status, code, message, fields);
  }
  return new ApiError(status, "http_error", `The server answered with status ${status}.`);
}

/**
 * POSTs a multipart form with XMLHttpRequest, because fetch reports no upload progress. Text
 * fields must be appended before the file: the server picks the size limit from them.
 */
export function uploadForm<T>(
  path: string,
  form: FormData,
  schema: z.ZodType<T>,
  onProgress?: (progress: UploadProgress) => void,
  signal?: AbortSignal,
): Promise<UploadResult<T>> {
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open("POST", path);
    xhr.withCredentials = true;
    xhr.setRequestHeader("Accept", "application/json");
    xhr.upload.addEventListener("progress", (event) => {
      if (event.lengthComputable) {
        onProgress?.({ loadedBytes: event.loaded, totalBytes: event.total });
      }
    });
    xhr.addEventListener("load", () => {
      if (xhr.status < 200 || xhr.status >= 300) {
        reject(errorOf(xhr.status, xhr.responseText));
        return;
      }
      let payload: unknown;
      try {
        payload = JSON.parse(xhr.responseText);
      } catch {
        payload = undefined;
      }
      const parsed = schema.safeParse(payload);
      if (!parsed.success) {
        reject(
          new ApiError(
            xhr.status,
            "bad_response",
            "The server sent an answer this page cannot read.",
          ),
        );
        return;
      }
      resolve({ status: xhr.status, body: parsed.data });
    });
    xhr.addEventListener("error", () =>
      reject(
        new ApiError(
          0,
          "network",
          "The upload was cut off before the server answered. Check the connection and try again.",
        ),
      ),
    );
    xhr.addEventListener("abort", () =>
      reject(new DOMException("The upload was cancelled.", "AbortError")),
    );
    signal?.addEventListener("abort", () => xhr.abort(), { once: true });
    xhr.send(form);
  });
}
