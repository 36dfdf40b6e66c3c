import { createHash, randomBytes } from "node:crypto";

/** 256 random bits, URL-safe: 43 characters. Only its SHA-256 is stored. */
export function newFeedToken() {
  const token = randomBytes(32).toString("base64url");
  return { token, tokenHash: hashFeedToken(token), tokenHint: token.slice(-4) };
}

export const hashFeedToken = (token: string) => createHash("sha256").update(token, "utf8").digest("hex");

export const TOKEN_PATTERN = /^[A-Za-z0-9_-]{43}$/;
