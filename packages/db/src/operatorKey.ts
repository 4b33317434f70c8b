/**
 * The operator key: opens every session's list and export. Only its sha256 is kept, in a file
 * in the data directory; with none configured, the first start makes one and hands it back
 * once, to be printed. Comparison is in constant time on digests, so neither the key's length
 * nor its bytes can be timed.
 */
import { createHash, timingSafeEqual } from "node:crypto";
import { existsSync, mkdirSync, readFileSync, writeFileSync } from "node:fs";
import path from "node:path";
import { newKey } from "./credentials";

export const OPERATOR_KEY_FILE = "operator-key.sha256";
/** Shorter operator keys are refused at start. */
export const OPERATOR_KEY_MIN_LENGTH = 24;

function digest(plaintext: string): Buffer {
  return createHash("sha256").update(plaintext, "utf8").digest();
}

export interface OperatorKey {
  /** sha256 of the key */
  digest: Buffer;
  /** the new key, only on the start that made it (print it once); otherwise null */
  created: string | null;
}

/**
 * The configured key (`configured`, e.g. from the environment) or the one whose digest is in
 * `dir`; when neither exists, a new one whose digest is written there (mode 0600).
 */
export function ensureOperatorKey(dir: string, configured: string | null): OperatorKey {
  if (configured !== null) {
    if (configured.length < OPERATOR_KEY_MIN_LENGTH) {
      throw new Error(`the operator key must be at least ${OPERATOR_KEY_MIN_LENGTH} characters`);
    }
    return { digest: digest(configured), created: null };
  }
  const file = path.join(dir, OPERATOR_KEY_FILE);
  if (existsSync(file)) {
    const hex = readFileSync(file, "utf8").trim();
    if (!/^[0-9a-f]{64}$/.test(hex)) throw new Error(`${file} does not hold a sha256 digest`);
    return { digest: Buffer.from(hex, "hex"), created: null };
  }
  const key = newKey();
  mkdirSync(dir, { recursive: true });
  writeFileSync(file, `${digest(key).toString("hex")}\n`, { mode: 0o600, flag: "wx" });
  return { digest: digest(key), created: key };
}

/** True when `presented` is the operator key; constant time in the presented key's content. */
export function isOperatorKey(operatorDigest: Buffer | null, presented: string): boolean {
  if (operatorDigest === null) return false;
  return timingSafeEqual(digest(presented), operatorDigest);
}
