import { createHash, randomBytes, randomInt } from "node:crypto";

/** Letters and digits that cannot be misread for one another when read aloud or off a screen (no 0/O, 1/I/L). */
export const JOIN_CODE_ALPHABET = "23456789ABCDEFGHJKMNPQRSTUVWXYZ";
export const JOIN_CODE_LENGTH = 6;

/** A new secret: 32 random bytes, base64url (43 characters). Shown once, stored only as its hash. */
export function newKey(): string {
  return randomBytes(32).toString("base64url");
}

/** The stored form of a key: sha256 of its UTF-8 bytes, lowercase hex. */
export function hashKey(plaintext: string): string {
  return createHash("sha256").update(plaintext, "utf8").digest("hex");
}

/** A short code a guest types to join (31^6, about 8.9e8 codes); uniqueness is enforced by the database. */
export function newJoinCode(): string {
  let code = "";
  for (let i = 0; i < JOIN_CODE_LENGTH; i++) {
    code += JOIN_CODE_ALPHABET[randomInt(JOIN_CODE_ALPHABET.length)];
  }
  return code;
}

/** Normalises what a guest typed: case and separators do not matter. */
export function normaliseJoinCode(input: string): string {
  return input.toUpperCase().replace(/[\s-]/g, "");
}
