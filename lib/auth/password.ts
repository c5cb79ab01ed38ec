import bcrypt from "bcryptjs";

// bcrypt cost 10: about 60–80 ms per check here, slow for a guesser, quick for a person.
const COST = 10;

export function hashPassword(plain: string): Promise<string> {
  return bcrypt.hash(plain, COST);
}

export function verifyPassword(plain: string, hash: string): Promise<boolean> {
  return bcrypt.compare(plain, hash);
}
