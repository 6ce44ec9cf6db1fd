import type { Cluster } from '../api/types.js';

/**
 * The label a theme shows: its name, or for an unnamed theme a stand-in made of its position and
 * first distinctive terms, so people can tell unnamed themes apart.
 * @param c the cluster
 * @param position its 0-based position in the analysis
 */
export function themeLabel(c: Cluster, position: number): string {
  if (c.name && c.name.trim()) return c.name;
  if (c.noContent) return 'No usable words';
  const terms = c.terms.slice(0, 3).join(' · ');
  return terms ? `#${position + 1} ${terms}` : `#${position + 1}`;
}
