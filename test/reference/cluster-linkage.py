#!/usr/bin/python3
"""Regenerates test/fixtures/cluster-linkage.json and test/fixtures/cluster-linkage-silhouette.json.

Reference: SciPy (scipy.cluster.hierarchy.linkage / fcluster, scipy.spatial.distance.pdist) and
scikit-learn (sklearn.metrics.silhouette_samples), as shipped by Debian's python3-scipy and
python3-sklearn. Run with Debian's interpreter from the repository root:

    /usr/bin/python3 test/reference/cluster-linkage.py

The points are random (fixed seeds), so regenerating gives the same files.
"""
import json
import os

import numpy as np
import scipy
import sklearn
from scipy.cluster.hierarchy import fcluster, linkage
from scipy.spatial.distance import pdist
from sklearn.metrics import silhouette_samples

HERE = os.path.dirname(os.path.abspath(__file__))
OUT = os.path.join(HERE, '..', 'fixtures')


def tree(points, method, metric):
    z = linkage(points, method=method, metric=metric)
    cuts = {str(k): fcluster(z, t=k, criterion='maxclust').tolist() for k in range(2, 9)}
    return {'method': method, 'metric': metric, 'linkage': z.tolist(), 'cuts': cuts}


def main():
    rng = np.random.default_rng(20260112)
    # 50 points in 5-D: four loose blobs plus noise, so the trees have structure and no ties.
    centres = rng.normal(scale=3.0, size=(4, 5))
    raw = np.vstack([centres[i % 4] + rng.normal(size=5) for i in range(50)])
    unit = raw / np.linalg.norm(raw, axis=1, keepdims=True)
    linkage_fixture = {
        'source': 'scipy.cluster.hierarchy.linkage and fcluster(criterion="maxclust"), SciPy ' + scipy.__version__,
        'raw': raw.tolist(),
        'unit': unit.tolist(),
        'trees': [
            dict(tree(raw, 'average', 'euclidean'), points='raw'),
            dict(tree(raw, 'complete', 'euclidean'), points='raw'),
            dict(tree(raw, 'ward', 'euclidean'), points='raw'),
            dict(tree(unit, 'average', 'cosine'), points='unit'),
            dict(tree(unit, 'complete', 'cosine'), points='unit'),
            dict(tree(unit, 'ward', 'euclidean'), points='unit'),
        ],
    }
    with open(os.path.join(OUT, 'cluster-linkage.json'), 'w') as f:
        json.dump(linkage_fixture, f, indent=0)

    # Silhouette with cosine distance on unit rows, including a singleton cluster and a duplicate row.
    rng = np.random.default_rng(7)
    x = rng.normal(size=(120, 8))
    x[:40, 0] += 3.0
    x[40:80, 1] += 3.0
    x[5] = x[6]
    x = x / np.linalg.norm(x, axis=1, keepdims=True)
    labels = np.zeros(120, dtype=int)
    labels[40:80] = 1
    labels[80:119] = 2
    labels[119] = 3
    s = silhouette_samples(x, labels, metric='cosine')
    silhouette_fixture = {
        'source': 'sklearn.metrics.silhouette_samples(metric="cosine"), scikit-learn ' + sklearn.__version__,
        'x': x.tolist(),
        'labels': labels.tolist(),
        'silhouettes': s.tolist(),
        'mean': float(np.mean(s)),
    }
    with open(os.path.join(OUT, 'cluster-linkage-silhouette.json'), 'w') as f:
        json.dump(silhouette_fixture, f, indent=0)


if __name__ == '__main__':
    main()
