import { createHash, randomBytes } from "node:crypto";

/** A URL-safe secret for e-mailed links, and the hash we store instead of it. */
export function newLinkToken(): { token: string; hash: string } {
  const token = randomBytes(32).toString("base64url");
  return { token, hash: hashToken(token) };
}

export function hashToken(token: string): string {
  return createHash("sha256").update(token).digest("hex");
}
