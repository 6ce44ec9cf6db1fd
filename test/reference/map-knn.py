"""Reference nearest neighbours for server/map/nearest-neighbors.ts.

Seeded clusters from scikit-learn's make_blobs, rows normalised to unit length and rounded to
float32 (9 significant digits round-trip float32), and their exact cosine k nearest neighbours from
sklearn.neighbors.NearestNeighbors(algorithm='brute', metric='cosine'), self excluded.
Writes test/fixtures/map-knn.json.

Run with Debian's python: /usr/bin/python3 test/reference/map-knn.py
"""
import json
import os

import numpy as np
import sklearn
from sklearn.datasets import make_blobs
from sklearn.neighbors import NearestNeighbors

OUT = os.path.join(os.path.dirname(__file__), '..', 'fixtures', 'map-knn.json')


def unit_f32(X):
    X = X / np.linalg.norm(X, axis=1, keepdims=True)
    return X.astype(np.float32).astype(np.float64)


def case(name, X, k):
    nn = NearestNeighbors(n_neighbors=k, algorithm='brute', metric='cosine').fit(X)
    dist, ind = nn.kneighbors()
    return {
        'name': name, 'n': int(X.shape[0]), 'd': int(X.shape[1]), 'k': k,
        'X': [float('%.9g' % v) for v in X.astype(np.float32).ravel()],
        'indices': ind.ravel().tolist(),
        'distances': [float('%.9g' % v) for v in dist.ravel()],
    }


def main():
    tiny, _ = make_blobs(n_samples=40, n_features=5, centers=3, random_state=11)
    big, _ = make_blobs(n_samples=3000, n_features=24, centers=15, cluster_std=1.5, random_state=5)
    out = {
        'source': 'sklearn.neighbors.NearestNeighbors(algorithm="brute", metric="cosine"), scikit-learn %s'
                  % sklearn.__version__,
        'cases': [case('tiny: 40 points, 5 dims, k=5', unit_f32(tiny), 5),
                  case('blobs: 3000 points, 24 dims, k=14', unit_f32(big), 14)],
    }
    with open(OUT, 'w') as f:
        json.dump(out, f)


if __name__ == '__main__':
    main()
