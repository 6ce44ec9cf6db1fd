"""Reference data for the map projection's quality test (test/map/project.test.ts).

scikit-learn's bundled handwritten digits (sklearn.datasets.load_digits: 1,797 images of 8x8
pixels, the UCI optical recognition of handwritten digits test set), rows scaled to unit length
and rounded to float32, with the trustworthiness@10 (cosine) of its two leading principal
components as a floor any useful map must clear, both from scikit-learn.
Writes test/fixtures/map-digits.json.

Run with Debian's python: /usr/bin/python3 test/reference/map-digits.py
"""
import json
import os

import numpy as np
import sklearn
from sklearn.datasets import load_digits
from sklearn.decomposition import PCA
from sklearn.manifold import trustworthiness

OUT = os.path.join(os.path.dirname(__file__), '..', 'fixtures', 'map-digits.json')


def main():
    digits = load_digits()
    X = digits.data / np.linalg.norm(digits.data, axis=1, keepdims=True)
    X = X.astype(np.float32).astype(np.float64)
    P = PCA(n_components=2, random_state=0).fit_transform(X)
    out = {
        'source': 'sklearn.datasets.load_digits and sklearn.manifold.trustworthiness, scikit-learn %s'
                  % sklearn.__version__,
        'n': int(X.shape[0]), 'd': int(X.shape[1]),
        'X': [float('%.9g' % v) for v in X.astype(np.float32).ravel()],
        'labels': digits.target.tolist(),
        'pcaTrustworthiness10': float(trustworthiness(X, P, n_neighbors=10, metric='cosine')),
    }
    with open(OUT, 'w') as f:
        json.dump(out, f)


if __name__ == '__main__':
    main()
