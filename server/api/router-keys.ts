import { createHash, randomBytes, timingSafeEqual } from 'node:crypto';

const KEY_PREFIX = 'shk_';

/** A new router key: shown once to the person who asked, stored only as its hash. */
export function newRouterKey(): { key: string; hash: string; prefix: string } {
  const key = KEY_PREFIX + randomBytes(30).toString('base64url');
  return { key, hash: hashKey(key), prefix: key.slice(0, KEY_PREFIX.length + 6) };
}

/**
 * SHA-256 of the key. Keys carry 240 random bits, so a fast hash is enough: there is nothing to
 * brute-force that a slow hash would protect.
 */
export function hashKey(key: string): string {
  return createHash('sha256').update(key).digest('hex');
}

/** Compares two hex hashes in constant time. */
export function sameHash(a: string, b: string): boolean {
  const x = Buffer.from(a, 'hex');
  const y = Buffer.from(b, 'hex');
  return x.length === y.length && timingSafeEqual(x, y);
}

/** The key from an `Authorization: Bearer …` header, or null. */
export function bearerKey(header: string | undefined): string | null {
  const m = /^Bearer\s+(\S+)\s*$/i.exec(header ?? '');
  return m ? m[1] : null;
}
