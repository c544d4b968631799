#!/usr/bin/env bash
# Side-by-side of Insola and the reference libraries, in one run on this machine.
#
#   bash crates/insola/benches/reference/compare.sh [ROUNDS]
#
# Creates a Python virtual environment outside the repository ($INSOLA_REF_VENV, default
# $HOME/.cache/insola-ref-venv) with pvlib and climlab from PyPI (climlab 0.9 also needs
# xarray, six, scipy and pooch at import time, which it does not declare), then interleaves
# ROUNDS (default 3) rounds of: the reference timings (reference_timings.py) and the Insola
# bench `reference` (benches/reference.rs). Prints per-item medians over the rounds and the
# ratios reference / Insola. Figures are for comparison on one machine, nothing more.
set -euo pipefail
here="$(cd "$(dirname "$0")" && pwd)"
repo="$(cd "$here/../../../.." && pwd)"
rounds="${1:-3}"
venv="${INSOLA_REF_VENV:-$HOME/.cache/insola-ref-venv}"
if [ ! -x "$venv/bin/python" ]; then
  python3 -m venv "$venv"
fi
"$venv/bin/python" -c "import pvlib, climlab" 2>/dev/null ||
  "$venv/bin/pip" install -q pvlib climlab xarray six scipy pooch
"$venv/bin/python" -c "import pvlib, climlab; print('pvlib', pvlib.__version__, '| climlab', climlab.__version__)" 2>/dev/null

cd "$repo"
cargo bench -p insola --bench reference --no-run -q 2>/dev/null
out="$(mktemp -d)"
for r in $(seq 1 "$rounds"); do
  echo "round $r / $rounds" >&2
  "$venv/bin/python" "$here/reference_timings.py" >>"$out/reference.txt"
  cargo bench -p insola --bench reference -q 2>/dev/null >>"$out/insola.txt"
done
"$venv/bin/python" - "$out" <<'PY'
import re, statistics, sys
out = sys.argv[1]
unit = {"ns": 1e-9, "µs": 1e-6, "us": 1e-6, "ms": 1e-3, "s": 1.0}
items = {"star_100k": 100_000, "daily_insolation/180x365": 180 * 365,
         "daily_insolation/1800x3650": 1800 * 3650}
insola, name = {}, None
for line in open(f"{out}/insola.txt"):
    m = re.match(r"^(\S+/\S+)", line)
    if m and not line.startswith(" "):
        name = m.group(1)
    t = re.search(r"time:\s+\[\S+ \S+ (\S+) (\S+) \S+ \S+\]", line)
    if t and name:
        group = name.rsplit("/", 1)[0] if name.startswith("star_100k") else name
        per = float(t.group(1)) * unit[t.group(2)] / items[group]
        insola.setdefault(name, []).append(per)
        name = None
ref = {}
for line in open(f"{out}/reference.txt"):
    k, v = line.split()
    ref.setdefault(k, []).append(float(v))
print(f"{'row':34} {'Insola ns/item':>15} {'reference ns/item':>18} {'ratio':>8}")
for name, vals in sorted(insola.items()):
    group = "star_100k" if name.startswith("star_100k") else name
    a, b = statistics.median(vals) * 1e9, statistics.median(ref[group]) * 1e9
    print(f"{name:34} {a:15.2f} {b:18.1f} {b / a:7.1f}x")
PY
