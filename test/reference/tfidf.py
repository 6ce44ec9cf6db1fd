"""Reference TF-IDF weights from scikit-learn for test/text/tfidf-reference.test.ts.

Reads test/fixtures/tfidf-tokens.json (our tokeniser's terms, made by test/reference/tfidf-tokens.ts)
and writes test/fixtures/tfidf.json: for each option set, scikit-learn's vocabulary, idf and dense
TF-IDF matrix, with the terms fed in as a pre-tokenised analyzer so only the weighting is compared.
Run from the repository root with Debian's Python (python3-sklearn 1.2):
    /usr/bin/python3 test/reference/tfidf.py
Deterministic: no randomness is involved.
"""
import json

import numpy as np
import sklearn
from sklearn.feature_extraction.text import TfidfVectorizer

with open("test/fixtures/tfidf-tokens.json", encoding="utf-8") as f:
    src = json.load(f)


def untied_limit(token_lists, want):
    """A max_features value near `want` with no tie in corpus frequency at the cut, so the kept set is unambiguous."""
    freq = {}
    for toks in token_lists:
        for t in toks:
            freq[t] = freq.get(t, 0) + 1
    counts = sorted(freq.values(), reverse=True)
    for k in list(range(want, len(counts))) + list(range(want - 1, 0, -1)):
        if counts[k - 1] != counts[k]:
            return k
    raise SystemExit("no untied cut")


# (name, our options, sklearn keyword arguments, which token lists)
CASES = [
    ("all-terms", {"minDf": 1, "maxDf": 1.0}, dict(min_df=1, max_df=1.0), "tokens"),
    ("pruned", {"minDf": 2, "maxDf": 0.5}, dict(min_df=2, max_df=0.5), "tokens"),
    ("pruned-counts", {"minDf": 2, "maxDf": 3}, dict(min_df=2, max_df=3), "tokens"),
    ("raw-tf-plain-idf-unnormalised", {"minDf": 1, "maxDf": 1.0, "sublinearTf": False, "smoothIdf": False, "normalize": False},
     dict(min_df=1, max_df=1.0, sublinear_tf=False, smooth_idf=False, norm=None), "tokens"),
    ("bigrams", {"minDf": 1, "maxDf": 1.0, "bigrams": True}, dict(min_df=1, max_df=1.0), "tokensWithBigrams"),
]
limit = untied_limit(src["tokens"], 12)
CASES.append(("capped", {"minDf": 1, "maxDf": 1.0, "maxTerms": limit}, dict(min_df=1, max_df=1.0, max_features=limit), "tokens"))

out = {"source": f"scikit-learn {sklearn.__version__} TfidfVectorizer (written by test/reference/tfidf.py)", "cases": []}
for name, ours, theirs, field in CASES:
    params = dict(analyzer=lambda toks: toks, lowercase=False, smooth_idf=True, sublinear_tf=True, norm="l2")
    params.update(theirs)
    v = TfidfVectorizer(**params)
    m = v.fit_transform(src[field]).toarray()
    out["cases"].append({
        "name": name,
        "options": ours,
        "sklearn": {k: val for k, val in params.items() if k != "analyzer"},
        "vocabulary": [str(t) for t in v.get_feature_names_out()],
        "idf": [float(x) for x in v.idf_],
        "matrix": [[float(x) for x in row] for row in np.asarray(m)],
    })

with open("test/fixtures/tfidf.json", "w", encoding="utf-8") as f:
    json.dump(out, f, ensure_ascii=False)
    f.write("\n")
print("wrote test/fixtures/tfidf.json:", ", ".join(f"{c['name']} ({len(c['vocabulary'])} terms)" for c in out["cases"]))
