// Browser-side calls to /api/v1 with the error shape the API always returns.
import "@/lib/validations/messages";
export type ApiError = { status: number; code: string; message: string; fields: Record<string, string>; offline?: boolean; current?: unknown };
export type ApiResult<T> = { ok: true; status: number; data: T } | { ok: false; error: ApiError };

/**
 * `timeoutMs`: give up when the server has not answered in that time (a weak signal that never
 * answers), reported like no connection so the caller keeps the entry and tries again later.
 */
export async function apiJson<T>(path: string, init: { method?: string; body?: unknown; timeoutMs?: number } = {}): Promise<ApiResult<T>> {
  const offline = (message: string): ApiResult<T> => ({ ok: false, error: { status: 0, code: "offline", offline: true, fields: {}, message } });
  const noConnection = "Not sent: no connection to the server. What you entered is kept on this device; try again when you have signal.";
  const timedOut = "Not sent: the server did not answer in time (weak signal). What you entered is kept on this device; it is tried again.";
  let res: Response;
  let text: string;
  try {
    res = await fetch(path, {
      method: init.method ?? (init.body === undefined ? "GET" : "POST"),
      headers: init.body === undefined ? undefined : { "content-type": "application/json" },
      body: init.body === undefined ? undefined : JSON.stringify(init.body),
      credentials: "same-origin",
      ...(init.timeoutMs ? { signal: AbortSignal.timeout(init.timeoutMs) } : {}),
    });
    text = await res.text();
  } catch (e) {
    return offline(e instanceof DOMException && e.name === "TimeoutError" ? timedOut : noConnection);
  }
  let body: unknown = null;
  try {
    body = text ? JSON.parse(text) : null;
  } catch {
    /* not JSON */
  }
  if (res.ok) return { ok: true, status: res.status, data: body as T };
  const err = (body as { error?: { code?: string; message?: string; fields?: Record<string, string>; current?: unknown } } | null)?.error;
  return {
    ok: false,
    error: {
      status: res.status,
      code: err?.code ?? "error",
      message: err?.message ?? (res.status === 401 ? "Your session has ended; sign in again (your entries are kept)." : `The server answered ${res.status}; try again.`),
      fields: err?.fields ?? {},
      // An edit conflict carries the record as the server has it now.
      ...(err?.current !== undefined ? { current: err.current } : {}),
    },
  };
}

/** PUTs a file to a presigned URL, reporting progress (0–1). Rejects with a sentence on failure. */
export function putWithProgress(url: string, file: Blob, contentType: string, onProgress: (fraction: number) => void, signal?: AbortSignal): Promise<void> {
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open("PUT", url);
    xhr.setRequestHeader("content-type", contentType);
    xhr.upload.onprogress = (e) => {
      if (e.lengthComputable) onProgress(e.loaded / e.total);
    };
    xhr.onload = () => (xhr.status >= 200 && xhr.status < 300 ? resolve() : reject(new Error(`The photo store refused the upload (${xhr.status}); retry.`)));
    xhr.onerror = () => reject(new Error("The upload was interrupted (connection lost); retry when you have signal."));
    xhr.onabort = () => reject(new Error("The upload was cancelled."));
    signal?.addEventListener("abort", () => xhr.abort());
    xhr.send(file);
  });
}
