import { createHash, randomBytes } from "node:crypto";

// Personal API tokens: "ctr_" + 32 random bytes. Only the SHA-256 is stored;
// a high-entropy token needs no slow hash.
const PREFIX = "ctr_";

export function generateApiToken(): { token: string; hash: string; prefix: string } {
  const token = PREFIX + randomBytes(32).toString("base64url");
  return { token, hash: hashApiToken(token), prefix: token.slice(0, PREFIX.length + 6) };
}

export function hashApiToken(token: string): string {
  return createHash("sha256").update(token).digest("hex");
}

export function looksLikeApiToken(value: string): boolean {
  return value.startsWith(PREFIX) && value.length > PREFIX.length + 20;
}
