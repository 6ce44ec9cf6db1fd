/**
 * The vocabulary a set of training documents would keep under the text pipeline's document-frequency
 * rules. The corpus is tokenised once with every term kept; each cross-validation fold then keeps
 * only the columns its own training rows justify, which is what fitting the vectoriser on those rows
 * alone would give, without tokenising the corpus once per fold.
 */

/** The document-frequency rules of `TfidfOptions` that decide which terms are kept. */
export interface VocabularyRule {
  /** At least this many documents (integer ≥ 1) or this fraction of them (0 < x < 1). */
  minDf: number;
  /** At most this fraction (0 < x ≤ 1) or count (integer > 1) of documents. */
  maxDf: number;
  /** At most this many terms, most occurrences first, ties by column (0 = no cap), as the text pipeline caps. */
  maxTerms: number;
}

/**
 * Chooses the kept columns.
 * @param df document frequency of each column over the training rows.
 * @param tf occurrences of each column over the training rows (orders the `maxTerms` cap).
 * @param documentCount number of training rows.
 * @param rule the document-frequency rules.
 * @returns the new index of each column (-1 when dropped; kept columns stay in order) and the count kept.
 */
export function foldVocabulary(df: Uint32Array, tf: Float64Array, documentCount: number, rule: VocabularyRule): { columnMap: Int32Array; kept: number } {
  const lo = rule.minDf >= 1 ? rule.minDf : Math.ceil(rule.minDf * documentCount);
  const hi = rule.maxDf <= 1 ? Math.floor(rule.maxDf * documentCount) : rule.maxDf;
  const columnMap = new Int32Array(df.length).fill(-1);
  const candidates: number[] = [];
  for (let j = 0; j < df.length; j++) if (df[j] >= Math.max(1, lo) && df[j] <= hi) candidates.push(j);
  let chosen = candidates;
  if (rule.maxTerms > 0 && candidates.length > rule.maxTerms) {
    chosen = candidates.slice().sort((a, b) => tf[b] - tf[a] || a - b).slice(0, rule.maxTerms).sort((a, b) => a - b);
  }
  for (let k = 0; k < chosen.length; k++) columnMap[chosen[k]] = k;
  return { columnMap, kept: chosen.length };
}
