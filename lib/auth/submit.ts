// The browser side of the onboarding forms: send JSON to /api/v1 and read the house error shape.
export type SubmitResult<T> =
  | { ok: true; status: number; body: T }
  | { ok: false; status: number; message: string; fields: Record<string, string> };

export async function submitJson<T = unknown>(url: string, method: string, body?: unknown): Promise<SubmitResult<T>> {
  let res: Response;
  try {
    res = await fetch(url, {
      method,
      headers: body === undefined ? undefined : { "content-type": "application/json" },
      body: body === undefined ? undefined : JSON.stringify(body),
    });
  } catch {
    return { ok: false, status: 0, message: "No connection to the server. Nothing was lost: try again when you have a signal.", fields: {} };
  }
  const text = await res.text();
  let parsed: unknown = null;
  try {
    parsed = text ? JSON.parse(text) : null;
  } catch {
    /* not JSON */
  }
  if (res.ok) return { ok: true, status: res.status, body: parsed as T };
  const err = (parsed as { error?: { message?: string; fields?: Record<string, string> } } | null)?.error;
  return { ok: false, status: res.status, message: err?.message ?? "Something went wrong; nothing was changed. Try again.", fields: err?.fields ?? {} };
}
