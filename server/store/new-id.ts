import { randomBytes } from 'node:crypto';

const ALPHABET = '0123456789abcdefghjkmnpqrstvwxyz';

/**
 * A fresh opaque id: a short prefix naming the kind (`c` corpus, `a` analysis, `j` job, `r`
 * router, `k` key) and 16 random base-32 characters (80 bits), so ids never collide in practice
 * and never reveal how many of anything exist.
 */
export function newId(prefix: string): string {
  const bytes = randomBytes(16);
  let out = prefix + '_';
  for (let i = 0; i < 16; i++) out += ALPHABET[bytes[i] & 31];
  return out;
}

/** True for strings shaped like our ids (used to refuse junk before it reaches a query). */
export function isIdShaped(s: string): boolean {
  return /^[a-z]{1,2}_[0-9a-z]{16}$/.test(s);
}
