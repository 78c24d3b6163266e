// The session cookie's flags (OWASP ASVS 4.0.3 V3.4.1–V3.4.3: Secure, HttpOnly, SameSite).
import { describe, expect, it } from "vitest";
import { sessionCookie } from "@/lib/security/headers";

describe("the session cookie", () => {
  it("is HttpOnly and SameSite=Lax always, Secure with the __Secure- prefix under https", () => {
    const https = sessionCookie(true);
    expect(https.name).toBe("__Secure-next-auth.session-token");
    expect(https.options).toMatchObject({ httpOnly: true, sameSite: "lax", secure: true, path: "/" });
    const http = sessionCookie(false);
    expect(http.name).toBe("next-auth.session-token");
    expect(http.options).toMatchObject({ httpOnly: true, sameSite: "lax", secure: false });
  });
});
