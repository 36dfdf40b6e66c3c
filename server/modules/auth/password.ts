import { Argon2id } from "oslo/password";
import { dictionary } from "@zxcvbn-ts/language-common";

// oslo's Argon2id defaults are OWASP's minimum: m=19456 KiB, t=2, p=1.
const argon2id = new Argon2id();

const common = new Set(dictionary["passwords-common"].map((p) => p.toLowerCase()));

export const hashPassword = (password: string) => argon2id.hash(password);
export const verifyPassword = (hash: string, password: string) => argon2id.verify(hash, password);

/** A reason the password is refused, or null. Length is checked by the shared schema. */
export function weakPasswordReason(password: string, email?: string): string | null {
  const lower = password.toLowerCase();
  if (common.has(lower)) return "That password is on lists of common passwords. Choose another.";
  if (/^(.)\1+$/.test(password)) return "A single repeated character is too easy to guess.";
  if (/^(.{1,4})\1+$/.test(password)) return "A short repeated pattern is too easy to guess.";
  if (email && lower === email.toLowerCase()) return "Do not use your e-mail address as your password.";
  return null;
}

/** A real hash verified when the account does not exist, so both answers take the same time. */
let dummyHash: Promise<string> | null = null;
export const timingSafeMiss = async (password: string) => {
  dummyHash ??= hashPassword("not-a-real-account-password");
  await verifyPassword(await dummyHash, password);
};
