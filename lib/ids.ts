// Crockford base32 without I, L, O, U: ids stay readable when read aloud over the phone.
const ALPHABET = "0123456789abcdefghjkmnpqrstvwxyz";

/** A random 20-character id (100 bits), safe in URLs. */
export function newId(): string {
  const bytes = new Uint8Array(20);
  crypto.getRandomValues(bytes);
  let out = "";
  for (const b of bytes) out += ALPHABET[b & 31];
  return out;
}

export function nowIso(): string {
  return new Date().toISOString();
}
