#!/usr/bin/env bash
# Regenerates every reference fixture in test/fixtures from scikit-learn / SciPy (Debian's
# python3-sklearn and python3-scipy). Each script is deterministic; run from the repository root.
set -euo pipefail
cd "$(dirname "$0")/../.."
PY=/usr/bin/python3
"$PY" -c 'import sklearn, scipy' 2>/dev/null || { echo "regenerate.sh: needs Debian's python3-sklearn and python3-scipy" >&2; exit 1; }
for script in test/reference/*.py; do
  echo "regenerating from $script"
  "$PY" "$script"
done
