import { createHash, randomBytes } from "node:crypto";

/** A random token for a link, and the hash we store: a leaked table gives no working links. */
export function newToken() {
  const token = randomBytes(32).toString("base64url");
  return { token, tokenHash: hashToken(token) };
}

export function hashToken(token: string) {
  return createHash("sha256").update(token).digest("hex");
}
