#!/usr/bin/python3
"""Regenerates test/fixtures/cluster-lsa.json: singular values of a sparse TF-IDF-like matrix.

Reference: SciPy's dense SVD (scipy.linalg.svdvals, LAPACK) and scikit-learn's TruncatedSVD
(arpack) and randomized_svd as shipped by Debian's python3-scipy / python3-sklearn. Run from the repository root with
Debian's interpreter:

    /usr/bin/python3 test/reference/cluster-lsa.py

Fixed seeds: regenerating gives the same file.
"""
import json
import os

import numpy as np
import scipy
import scipy.sparse as sp
from scipy.linalg import svdvals
from sklearn.decomposition import TruncatedSVD
from sklearn.utils.extmath import randomized_svd

HERE = os.path.dirname(os.path.abspath(__file__))
OUT = os.path.join(HERE, '..', 'fixtures', 'cluster-lsa.json')
rng = np.random.default_rng(11)

# 400 documents × 600 terms, ~4 % dense, with low-rank structure (5 topics) plus noise, rows unit length.
n, m, topics = 400, 600, 5
topic_terms = rng.random((topics, m)) ** 6
doc_topics = rng.dirichlet(np.full(topics, 0.3), size=n)
expected = doc_topics @ topic_terms
mask = rng.random((n, m)) < 0.04 + 0.5 * expected / expected.max()
values = np.where(mask, rng.random((n, m)) + expected * 3, 0.0).astype(np.float32)
values /= np.maximum(np.linalg.norm(values, axis=1, keepdims=True), 1e-12)
x = sp.csr_matrix(values.astype(np.float32))
x.sort_indices()

full = svdvals(x.toarray().astype(np.float64))
head80 = svdvals(x[:80].toarray().astype(np.float64))
arpack = TruncatedSVD(n_components=30, algorithm='arpack', random_state=0).fit(x.astype(np.float64)).singular_values_
# The same randomised method as ours, with scikit-learn's TruncatedSVD defaults (5 power iterations,
# 10 oversamples), to say how close a randomised range finder gets on this flat, noisy spectrum.
_, randomized, _ = randomized_svd(x.astype(np.float64), 30, n_oversamples=10, n_iter=5, random_state=0)

with open(OUT, 'w') as f:
    json.dump({
        'source': f'SciPy {scipy.__version__} svdvals (LAPACK) and scikit-learn TruncatedSVD(arpack) (Debian python3-scipy / python3-sklearn)',
        'rows': n, 'cols': m,
        'indptr': x.indptr.tolist(), 'indices': x.indices.tolist(), 'values': [float(v) for v in x.data],
        'singularValues': full.tolist(), 'arpackTop30': arpack.tolist(), 'randomizedTop30': randomized.tolist(), 'head80SingularValues': head80.tolist(),
        'frobeniusSquared': float((x.toarray().astype(np.float64) ** 2).sum()),
    }, f)
print('wrote', OUT)
