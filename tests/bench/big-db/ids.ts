import { randomBytes } from "node:crypto";

// The app's id alphabet and length (lib/ids.ts), drawn from a pooled random
// buffer: two million ids one system call at a time cost several seconds.
const ALPHABET = "0123456789abcdefghjkmnpqrstvwxyz";
const POOL = 20 * 8_192;
let pool = randomBytes(POOL);
let offset = 0;

export function bulkId(): string {
  if (offset + 20 > POOL) {
    pool = randomBytes(POOL);
    offset = 0;
  }
  let out = "";
  for (let i = 0; i < 20; i++) out += ALPHABET[pool[offset + i]! & 31];
  offset += 20;
  return out;
}
