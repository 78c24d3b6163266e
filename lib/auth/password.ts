import bcrypt from "bcryptjs";

const COST = 10;

export function hashPassword(plain: string): Promise<string> {
  return bcrypt.hash(plain, COST);
}

export function verifyPassword(plain: string, hash: string): Promise<boolean> {
  return bcrypt.compare(plain, hash);
}

let dummy: Promise<string> | null = null;
/** A hash to compare against when the e-mail is unknown, so timing does not reveal accounts. */
export function dummyHash(): Promise<string> {
  dummy ??= hashPassword("no-such-account-placeholder");
  return dummy;
}
