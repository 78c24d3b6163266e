// Whether the server can be reached now. navigator.onLine says only that a network exists (a
// phone on a basement's weak Wi-Fi says "online"), so this asks the server itself; the service
// worker never answers /api/v1/ping from its cache.
export async function serverReachable(timeoutMs = 5000): Promise<boolean> {
  if (typeof navigator !== "undefined" && navigator.onLine === false) return false;
  try {
    const res = await fetch("/api/v1/ping", { cache: "no-store", signal: AbortSignal.timeout(timeoutMs) });
    return res.ok;
  } catch {
    return false;
  }
}
