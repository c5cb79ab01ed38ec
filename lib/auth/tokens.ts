import { createHash, randomBytes } from "node:crypto";

// Personal API tokens: "ctr_" + 32 random bytes. Only the SHA-256 is stored;
// a high-entropy token needs no slow hash.
const PREFIX = "ctr_";

export function generateApiToken(): { token: string; hash: string; prefix: string } {
  const token = PREFIX + randomBytes(32).toString("base64url");
  return { token, hash: hashApiToken(token), prefix: token.slice(0, PREFIX.length + 6) };
}

export function hashApiToken(token: string): string {
  return sha256Hex(token);
}

export function sha256Hex(text: string): string {
  return createHash("sha256").update(text).digest("hex");
}

/**
 * The secret in an invitation or password-reset link: 32 random bytes. Like an
 * API token, only its SHA-256 is stored, so a copy of the database opens no link.
 */
export function generateLinkToken(): { token: string; hash: string } {
  const token = randomBytes(32).toString("base64url");
  return { token, hash: sha256Hex(token) };
}

/** A link token as it arrives in a URL or a body: 43 base64url characters, nothing else. */
export function looksLikeLinkToken(value: string): boolean {
  return /^[A-Za-z0-9_-]{43}$/.test(value);
}

export function looksLikeApiToken(value: string): boolean {
  return value.startsWith(PREFIX) && value.length > PREFIX.length + 20;
}
