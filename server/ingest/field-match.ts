/**
 * Finds `wanted` among `names`: an exact match first, else the one name equal to it ignoring case
 * and surrounding spaces. Returns -1 when there is none or the loose match is ambiguous.
 */
export function findField(names: readonly string[], wanted: string): number {
  const exact = names.indexOf(wanted);
  if (exact >= 0) return exact;
  const loose = wanted.trim().toLowerCase();
  let found = -1;
  for (let i = 0; i < names.length; i++) {
    if (names[i]!.trim().toLowerCase() !== loose) continue;
    if (found >= 0) return -1;
    found = i;
  }
  return found;
}

/** Lists field names for a message, shortened when there are many. */
export function listFields(names: readonly string[]): string {
  if (names.length === 0) return '(none)';
  const shown = names.slice(0, 20).map((n) => JSON.stringify(n)).join(', ');
  return names.length > 20 ? `${shown} and ${names.length - 20} more` : shown;
}

/**
 * Sets `meta[key] = value` as an own, enumerable property even for the key `__proto__`, which a
 * plain assignment would turn into a prototype change (and lose from the stored metadata).
 */
export function setField(meta: Record<string, unknown>, key: string, value: unknown): void {
  if (key === '__proto__') Object.defineProperty(meta, key, { value, enumerable: true, writable: true, configurable: true });
  else meta[key] = value;
}
