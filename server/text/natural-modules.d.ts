// natural ships no declarations for its submodules. The server no longer uses natural's Porter
// stemmer (server/text/porter-stem.ts reimplements it); this declaration lets the tests and the
// tfidf bench, which keep natural as the reference and the peer, import it with types.
declare module 'natural/lib/natural/stemmers/porter_stemmer.js' {
  /** Porter (1980) stemmer. Lower-cases its input; words shorter than 3 letters come back unchanged. */
  const PorterStemmer: { stem(word: string): string };
  export default PorterStemmer;
}
