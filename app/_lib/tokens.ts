import { createHash, randomBytes } from "node:crypto";

/** A single-use secret for a link: 32 random bytes, base64url. Only its hash is stored. */
export function newLinkToken(): string {
  return randomBytes(32).toString("base64url");
}

export function hashToken(token: string): string {
  return createHash("sha256").update(token).digest("hex");
}

export function newUserId(): string {
  return randomBytes(15).toString("base64url");
}
