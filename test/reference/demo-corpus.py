"""Outside checks of the invented demo corpus, corpora/demo.csv.

Run with Debian's python:  /usr/bin/python3 test/reference/demo-corpus.py
Writes test/fixtures/demo-corpus.json. Deterministic: fixed seeds throughout.

Two things are recorded:
1. How Python's own csv module (an independent RFC 4180 reader) reads the file: the header, the
   row count, and a short digest of every row, so the TypeScript test can check that its reader
   and Python's agree field for field.
2. How a plain scikit-learn pipeline fares on the demo, so we know the demo is neither trivial nor
   hopeless for the job sheaf does: 5-fold cross-validated accuracy of multinomial naive Bayes on
   word counts, and the adjusted Rand index (Hubert & Arabie 1985) of k-means on TF-IDF against
   the intended themes.
"""
import csv
import hashlib
import json
import os

import numpy as np
import sklearn
from sklearn.cluster import KMeans
from sklearn.feature_extraction.text import CountVectorizer, TfidfVectorizer
from sklearn.metrics import adjusted_rand_score
from sklearn.model_selection import StratifiedKFold, cross_val_score
from sklearn.naive_bayes import MultinomialNB

ROOT = os.path.join(os.path.dirname(__file__), "..", "..")
SOURCE = os.path.join(ROOT, "corpora", "demo.csv")
OUT = os.path.join(ROOT, "test", "fixtures", "demo-corpus.json")

with open(SOURCE, "rb") as f:
    raw = f.read()
with open(SOURCE, newline="", encoding="utf-8") as f:
    records = list(csv.reader(f, strict=True))
header, rows = records[0], records[1:]


def row_digest(fields):
    """First 16 hex digits of SHA-256 over the fields joined by U+001F, UTF-8 encoded."""
    return hashlib.sha256("\x1f".join(fields).encode("utf-8")).hexdigest()[:16]


text_col = header.index("text")
label_col = header.index("intended_theme")
texts = [r[text_col] for r in rows]
labels = [r[label_col] for r in rows]
themes = sorted(set(labels))
y = np.array([themes.index(t) for t in labels])

counts = CountVectorizer(stop_words="english").fit_transform(texts)
folds = StratifiedKFold(n_splits=5, shuffle=True, random_state=0)
nb_accuracy = cross_val_score(MultinomialNB(alpha=1.0), counts, y, cv=folds, scoring="accuracy")

tfidf = TfidfVectorizer(stop_words="english", sublinear_tf=True).fit_transform(texts)
km = KMeans(n_clusters=len(themes), n_init=10, random_state=0).fit(tfidf)
ari = adjusted_rand_score(y, km.labels_)

fixture = {
    "source": "corpora/demo.csv read by Python csv (strict); scikit-learn " + sklearn.__version__,
    "fileSha256": hashlib.sha256(raw).hexdigest(),
    "header": header,
    "rowCount": len(rows),
    "rowDigests": [row_digest(r) for r in rows],
    "themeCounts": {t: labels.count(t) for t in themes},
    "naiveBayesCvAccuracy": float(np.mean(nb_accuracy)),
    "kmeansAdjustedRand": float(ari),
}
with open(OUT, "w", encoding="utf-8") as f:
    json.dump(fixture, f, indent=1, ensure_ascii=False)
    f.write("\n")
print(f"wrote {OUT}: {len(rows)} rows, NB 5-fold accuracy {fixture['naiveBayesCvAccuracy']:.3f}, "
      f"k-means ARI {ari:.3f}")
