"""Peer for bench/cluster.ts: scikit-learn's standard text-clustering pipeline on the same
generated documents. Run with Debian's /usr/bin/python3 (python3-sklearn). Prints one JSON line."""
import json, resource, sys, time
import numpy as np
import sklearn
from sklearn.feature_extraction.text import TfidfVectorizer
from sklearn.decomposition import TruncatedSVD
from sklearn.preprocessing import Normalizer
from sklearn.cluster import KMeans
from sklearn.metrics import silhouette_score, adjusted_rand_score, normalized_mutual_info_score

d = sys.argv[1]
texts = open(f"{d}/docs.txt", encoding="utf8").read().split("\n")
themes = json.load(open(f"{d}/themes.json"))

t = time.perf_counter()
x = TfidfVectorizer(sublinear_tf=True, min_df=2, max_df=0.5).fit_transform(texts)
t_tfidf = time.perf_counter() - t
t = time.perf_counter()
z = Normalizer(copy=False).fit_transform(TruncatedSVD(100, random_state=1).fit_transform(x))
t_svd = time.perf_counter() - t
t = time.perf_counter()
scores = {}
for k in range(2, 31):
    labels = KMeans(k, n_init=1, random_state=1).fit_predict(z)
    scores[k] = silhouette_score(z, labels, metric="cosine", sample_size=4000, random_state=1)
best = max(scores, key=scores.get)
t_sweep = time.perf_counter() - t
t = time.perf_counter()
labels = KMeans(best, n_init=4, random_state=1).fit_predict(z)
t_final = time.perf_counter() - t
print(json.dumps({
    "version": sklearn.__version__, "k": int(best), "tfidf": t_tfidf, "svd": t_svd, "sweep": t_sweep, "final": t_final,
    "peakRssMb": resource.getrusage(resource.RUSAGE_SELF).ru_maxrss / 1024,
    "ari": adjusted_rand_score(themes, labels), "nmi": normalized_mutual_info_score(themes, labels),
}))
