// A signed-in HTTP client for the running test app, through next-auth's own credential flow.
export const APP_URL = process.env.APP_URL ?? "http://127.0.0.1:3100";
export const INBOX_URL = process.env.INBOX_URL ?? "http://127.0.0.1:2080";
export const DEMO_PASSWORD = "strutwise-demo";

export type Client = {
  email: string | null;
  fetch: (path: string, init?: RequestInit) => Promise<Response>;
  json: <T = unknown>(path: string, init?: Omit<RequestInit, "body"> & { body?: unknown }) => Promise<{ status: number; body: T }>;
};

function cookiesFrom(res: Response, jar: Map<string, string>) {
  for (const c of res.headers.getSetCookie()) {
    const [pair] = c.split(";");
    const i = pair!.indexOf("=");
    jar.set(pair!.slice(0, i), pair!.slice(i + 1));
  }
}

function makeClient(email: string | null, jar: Map<string, string>): Client {
  const doFetch = (path: string, init: RequestInit = {}) => {
    const headers = new Headers(init.headers);
    if (jar.size) headers.set("cookie", [...jar].map(([k, v]) => `${k}=${v}`).join("; "));
    return fetch(`${APP_URL}${path}`, { ...init, headers, redirect: "manual" });
  };
  return {
    email,
    fetch: doFetch,
    async json(path, init = {}) {
      const { body, ...rest } = init;
      const headers = new Headers(rest.headers);
      let payload: BodyInit | undefined;
      if (body !== undefined) {
        headers.set("content-type", "application/json");
        payload = typeof body === "string" ? body : JSON.stringify(body);
      }
      const res = await doFetch(path, { ...rest, headers, body: payload });
      const text = await res.text();
      let parsed: unknown = text;
      try {
        parsed = text ? JSON.parse(text) : null;
      } catch {
        /* not JSON */
      }
      return { status: res.status, body: parsed as never };
    },
  };
}

export function anonymous(): Client {
  return makeClient(null, new Map());
}

export async function signInAs(email: string, password = DEMO_PASSWORD): Promise<Client> {
  const jar = new Map<string, string>();
  const csrfRes = await fetch(`${APP_URL}/api/auth/csrf`);
  cookiesFrom(csrfRes, jar);
  const { csrfToken } = (await csrfRes.json()) as { csrfToken: string };
  const res = await fetch(`${APP_URL}/api/auth/callback/credentials`, {
    method: "POST",
    headers: {
      "content-type": "application/x-www-form-urlencoded",
      cookie: [...jar].map(([k, v]) => `${k}=${v}`).join("; "),
    },
    body: new URLSearchParams({ csrfToken, email, password, json: "true" }),
    redirect: "manual",
  });
  cookiesFrom(res, jar);
  if (![...jar.keys()].some((k) => k.includes("session-token"))) {
    throw new Error(`sign-in as ${email} failed (status ${res.status})`);
  }
  return makeClient(email, jar);
}

export type Email = {
  to: string[];
  from: string;
  subject: string;
  date: string;
  text: string;
  attachments: { filename: string; contentType: string; size: number }[];
};

export async function inbox(): Promise<Email[]> {
  const r = await fetch(`${INBOX_URL}/api/email`);
  return (await r.json()) as Email[];
}

export async function clearInbox() {
  await fetch(`${INBOX_URL}/api/email`, { method: "DELETE" });
}

/** Polls until `check` returns a value (bounded; fails with the last state when it never does). */
export async function waitFor<T>(check: () => Promise<T | null | undefined | false>, what: string, timeoutMs = 20_000): Promise<T> {
  const until = Date.now() + timeoutMs;
  let last: unknown;
  while (Date.now() < until) {
    const v = await check();
    if (v) return v;
    last = v;
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error(`timed out waiting for ${what} (last: ${JSON.stringify(last)})`);
}
