#!/usr/bin/python3
"""Regenerates test/fixtures/cluster-kmeans.json: k-means objectives to compare spherical k-means with.

Reference: scikit-learn's KMeans (Lloyd, k-means++ seeding, n_init=10) as shipped by Debian's
python3-sklearn. The points are unit-normalised, where squared euclidean distance equals
2·(1 − cos), so sklearn's inertia is comparable with a cosine objective. Run from the repository
root with Debian's interpreter:

    /usr/bin/python3 test/reference/cluster-kmeans.py

Fixed seeds: regenerating gives the same file.
"""
import json
import os

import numpy as np
import sklearn
from sklearn.cluster import KMeans

HERE = os.path.dirname(os.path.abspath(__file__))
OUT = os.path.join(HERE, '..', 'fixtures', 'cluster-kmeans.json')
rng = np.random.default_rng(7)


def unit(x):
    return x / np.linalg.norm(x, axis=1, keepdims=True)


def spherical_objective(x, labels, k):
    """2·Σ(1 − x·ĉ) with ĉ the normalised mean of each cluster: the spherical k-means objective in
    squared-chord units."""
    total = 0.0
    for c in range(k):
        members = x[labels == c]
        if len(members) == 0:
            continue
        centre = members.sum(axis=0)
        centre /= np.linalg.norm(centre)
        total += 2 * (1 - members @ centre).sum()
    return float(total)


# Harder: 10 overlapping directions in 20-D, unequal sizes.
k_hard = 10
centres = rng.normal(0, 1, size=(k_hard, 20))
sizes = rng.integers(40, 120, size=k_hard)
hard = unit(np.vstack([centres[c] + rng.normal(0, 0.9, size=(s, 20)) for c, s in enumerate(sizes)]))
km = KMeans(n_clusters=k_hard, n_init=10, random_state=0).fit(hard)

# Well separated: 6 tight, far-apart directions in 15-D; the planted partition is the answer.
k_easy = 6
directions = unit(rng.normal(0, 1, size=(k_easy, 15))) * 10
planted = rng.integers(0, k_easy, size=300)
easy = unit(directions[planted] + rng.normal(0, 0.6, size=(300, 15)))

with open(OUT, 'w') as f:
    json.dump({
        'source': f'scikit-learn {sklearn.__version__} KMeans(n_init=10, random_state=0) (Debian python3-sklearn)',
        'hard': {'points': hard.tolist(), 'k': k_hard, 'inertia': float(km.inertia_),
                 'sphericalObjectiveOfSklearnLabels': spherical_objective(hard, km.labels_, k_hard)},
        'easy': {'points': easy.tolist(), 'k': k_easy, 'planted': planted.tolist()},
    }, f)
print('wrote', OUT)
