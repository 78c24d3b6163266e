// Link tokens (invitations, password resets): 32 random bytes in the link, only their SHA-256 stored.
import { createHash, randomBytes } from "node:crypto";

export const TOKEN_BYTES = 32;

export function hashToken(token: string): string {
  return createHash("sha256").update(token, "utf8").digest("hex");
}

export function newToken(): { token: string; hash: string } {
  const token = randomBytes(TOKEN_BYTES).toString("base64url");
  return { token, hash: hashToken(token) };
}

/** A token as it appears in a link: base64url of 32 bytes is 43 characters. Anything else is refused early. */
export function looksLikeToken(value: unknown): value is string {
  return typeof value === "string" && /^[A-Za-z0-9_-]{43}$/.test(value);
}
