// natural ships no declarations for its submodules; we import the Porter stemmer alone because the
// package's top-level entry loads every tool it has (slow, and noisy on stderr).
declare module 'natural/lib/natural/stemmers/porter_stemmer.js' {
  /** Porter (1980) stemmer. Lower-cases its input; words shorter than 3 letters come back unchanged. */
  const PorterStemmer: { stem(word: string): string };
  export default PorterStemmer;
}
