"""Reference values for server/map/trustworthiness.ts.

Runs scikit-learn's sklearn.manifold.trustworthiness (Debian python3-sklearn 1.2) on seeded random
inputs and writes them with the expected values to test/fixtures/map-trustworthiness.json.
Values are rounded to float32 first (printed with 9 significant digits, which round-trips float32)
so the TypeScript side reads exactly the numbers scikit-learn saw.

Run with Debian's python: /usr/bin/python3 test/reference/map-trustworthiness.py
"""
import json
import os

import numpy as np
import sklearn
from sklearn.datasets import make_blobs
from sklearn.decomposition import PCA
from sklearn.manifold import trustworthiness

OUT = os.path.join(os.path.dirname(__file__), '..', 'fixtures', 'map-trustworthiness.json')


def f32(a):
    return np.asarray(a, dtype=np.float32).astype(np.float64)


def flat(a):
    return [float('%.9g' % v) for v in np.asarray(a, dtype=np.float32).ravel()]


def case(name, X, Y, k, metric):
    X = f32(X)
    Y = f32(Y)
    t = trustworthiness(X, Y, n_neighbors=k, metric=metric)
    return {
        'name': name, 'metric': metric, 'k': k, 'n': int(X.shape[0]), 'd': int(X.shape[1]),
        'lowDims': int(Y.shape[1]), 'X': flat(X), 'Y': flat(Y), 'expected': float(t),
    }


def main():
    rng = np.random.RandomState(20260101)
    cases = []
    # Unstructured data and a noisy linear projection of it.
    X = rng.normal(size=(120, 12))
    Y = X @ rng.normal(size=(12, 2)) + 0.3 * rng.normal(size=(120, 2))
    cases.append(case('gaussian 120x12, noisy projection, k=5', X, Y, 5, 'euclidean'))
    cases.append(case('gaussian 120x12, noisy projection, k=10', X, Y, 10, 'euclidean'))
    cases.append(case('gaussian 120x12, noisy projection, k=10, cosine', X, Y, 10, 'cosine'))
    # Clustered data and its two leading principal components.
    B, _ = make_blobs(n_samples=150, n_features=20, centers=5, cluster_std=2.0, random_state=3)
    P = PCA(n_components=2, random_state=0).fit_transform(f32(B))
    cases.append(case('5 blobs 150x20, PCA to 2-D, k=7', B, P, 7, 'euclidean'))
    cases.append(case('5 blobs 150x20, PCA to 2-D, k=7, cosine', B, P, 7, 'cosine'))
    # A random embedding: far from trustworthy, checks the penalty sum on large ranks.
    R = rng.uniform(size=(150, 2))
    cases.append(case('5 blobs 150x20, random 2-D points, k=10', B, R, 10, 'euclidean'))
    with open(OUT, 'w') as f:
        json.dump({'source': 'sklearn.manifold.trustworthiness, scikit-learn %s' % sklearn.__version__,
                   'cases': cases}, f)


if __name__ == '__main__':
    main()
