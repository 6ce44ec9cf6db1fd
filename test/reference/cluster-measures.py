#!/usr/bin/python3
"""Regenerates test/fixtures/cluster-measures.json: silhouettes and partition-agreement scores.

Reference: scikit-learn (sklearn.metrics.silhouette_samples, silhouette_score,
adjusted_rand_score, normalized_mutual_info_score) as shipped by Debian's python3-sklearn.
Run with Debian's interpreter from the repository root:

    /usr/bin/python3 test/reference/cluster-measures.py

Inputs are random with fixed seeds, so regenerating gives the same file.
"""
import json
import os

import numpy as np
import sklearn
from sklearn.metrics import (adjusted_rand_score, normalized_mutual_info_score,
                             silhouette_samples, silhouette_score)

HERE = os.path.dirname(os.path.abspath(__file__))
OUT = os.path.join(HERE, '..', 'fixtures', 'cluster-measures.json')
rng = np.random.default_rng(20260301)

silhouettes = []
# Overlapping blobs in 6-D, one cluster of a single point (its silhouette is 0 by definition).
for case, (n, k, dim, spread) in enumerate([(90, 4, 6, 1.5), (150, 7, 12, 3.0)]):
    centres = rng.normal(0, 3, size=(k, dim))
    labels = rng.integers(0, k - 1, size=n)
    labels[-1] = k - 1  # the singleton
    points = centres[labels] + rng.normal(0, spread, size=(n, dim))
    entry = {'points': points.tolist(), 'labels': labels.tolist(), 'k': k}
    for metric in ('cosine', 'euclidean'):
        entry[metric] = {
            'samples': silhouette_samples(points, labels, metric=metric).tolist(),
            'score': float(silhouette_score(points, labels, metric=metric)),
        }
    silhouettes.append(entry)

agreement = []
for n, ka, kb in [(50, 3, 3), (200, 5, 8), (1000, 12, 10), (30, 2, 6)]:
    a = rng.integers(0, ka, size=n)
    # Partly agreeing: copy a, then scramble a fraction.
    b = a.copy() % kb
    flip = rng.random(n) < 0.3
    b[flip] = rng.integers(0, kb, size=flip.sum())
    agreement.append({'a': a.tolist(), 'b': b.tolist(),
                      'ari': float(adjusted_rand_score(a, b)),
                      'nmi': float(normalized_mutual_info_score(a, b))})
# Edge cases: identical up to renaming, one side a single class, every item its own class.
edge = [([0, 0, 1, 1, 2, 2], [5, 5, 3, 3, 9, 9]), ([0, 0, 0, 0], [0, 1, 2, 3]),
        ([0, 1, 2, 3], [0, 1, 2, 3]), ([1, 1, 1], [4, 4, 4]), ([0, 0, 1, 1], [0, 1, 0, 1])]
for a, b in edge:
    agreement.append({'a': a, 'b': b, 'ari': float(adjusted_rand_score(a, b)),
                      'nmi': float(normalized_mutual_info_score(a, b))})

with open(OUT, 'w') as f:
    json.dump({'source': f'scikit-learn {sklearn.__version__} (Debian python3-sklearn)',
               'silhouettes': silhouettes, 'agreement': agreement}, f)
print('wrote', OUT)
