#!/usr/bin/env bash
# Benchmark (run by hand, figures in docs/performance.md): a table rebuild after a line-list revision, end to end
# (`linewright build`, JVM start included). Lines: jittered copies of the real N2O and PH3 samples in 500-900 cm-1
# (two bands, the N2O one dense), grid 500-900 cm-1 at 0.002 cm-1, pressures 0.01/0.1/1/10 bar x temperatures
# 200/296/500 K, air, 25 cm-1 cutoff, Arrow output, blocks chosen by the engine. Steps, all in one run:
#   1. first build of the list;
#   2. the intensities of 1 % of the lines (consecutive, in the densest band at 560 cm-1) doubled: rebuild, and a
#      build from scratch of the revised list in another folder (2 threads) for the time and the sigma bits;
#   3. then one more line's intensity doubled: rebuild, and a build from scratch again.
# Each rebuild's sigma SHA-256 must equal its scratch build's.
#
#     tools/bench-rebuild-lines.sh [ENGINE] [LINES] [WORK_DIR]   (default exact 20000 /tmp/linewright-bench-rebuild)
set -euo pipefail
cd "$(dirname "$(readlink -f "$0")")/.."
engine="${1:-exact}"
lines="${2:-20000}"
work="${3:-/tmp/linewright-bench-rebuild}"
samples=../shared/reference-data/hitran2020-samples
rm -rf "$work"
mkdir -p "$work/table" "$work/scratch"
python3 tools/jitter-sample.py "$work/list.par" "$lines" 500 900 0.5 "$samples/sample_N2O.par" "$samples/sample_PH3.par"
for d in table scratch; do
    cat > "$work/$d/plan.toml" <<PLAN
# SYNTHETIC benchmark plan: jittered copies of published records (two bands)
[lines]
sources = ["list.par"]
[grid]
wavenumber = { from = 500.0, to = 900.0, step = 0.002 }
pressures_bar = [0.01, 0.1, 1.0, 10.0]
temperatures_K = [200.0, 296.0, 500.0]
[background]
air = 1.0
[species]
vmr = { N2O = 1.0, PH3 = 1.0 }
[profile]
engine = "$engine"
cutoff_cm1 = 25.0
[output]
table = "table.arrow"
PLAN
done
# revised lists: 1 % of the lines from 560 cm-1 on with doubled intensity; then one more line (5 % further on)
python3 - "$work/list.par" "$lines" <<'PY'
import sys
path, n = sys.argv[1], int(sys.argv[2])
rows = open(path, encoding='latin-1').read().splitlines()
start = next(i for i, r in enumerate(rows) if float(r[3:15]) >= 560.0)
def doubled(r):
    return r[:15] + '%10.3E' % (2 * float(r[15:25])) + r[25:]
one = list(rows)
for i in range(start, start + n // 100):
    one[i] = doubled(one[i])
two = list(one)
k = start + n // 20
two[k] = doubled(two[k])
for name, v in (('one-percent.par', one), ('one-line.par', two)):
    open(path.replace('list.par', name), 'w', encoding='latin-1').write('\n'.join(v) + '\n')
PY
./linewright --version >/dev/null   # builds the tool when needed (not timed)
seconds() { local s e; s=$(date +%s.%N); "$@" >"$work/last.log" 2>&1; e=$(date +%s.%N); echo "$e - $s" | bc; }
sigma() { grep '^sigma_sha256=' "$work/$1/table.arrow.work/manifest.properties" | cut -d= -f2; }
echo "machine: $(nproc) cores, $(java -version 2>&1 | head -n 1); engine $engine, $lines lines; load $(cut -d' ' -f1-3 /proc/loadavg)"
cp "$work/list.par" "$work/table/list.par"
first=$(seconds ./linewright build "$work/table/plan.toml" --threads 2)
echo "first build: $first s ($(grep '^blocks:' "$work/last.log"))"
for step in one-percent one-line; do
    cp "$work/$step.par" "$work/table/list.par"
    ./linewright build "$work/table/plan.toml" --dry-run > "$work/dry.log" 2>&1
    rebuild=$(seconds ./linewright build "$work/table/plan.toml" --threads 2)
    summary=$(grep -E '^(changed lines|[0-9]+ block)' "$work/last.log" || true)
    rm -rf "$work/scratch/table.arrow"* "$work/scratch/.linewright-cache"
    cp "$work/$step.par" "$work/scratch/list.par"
    scratch=$(seconds ./linewright build "$work/scratch/plan.toml" --threads 2)
    same=$([[ "$(sigma table)" == "$(sigma scratch)" ]] && echo "same sigma bits" || echo "SIGMA DIFFERS")
    echo "$step: rebuild $rebuild s, scratch $scratch s: $(echo "scale=1; $scratch / $rebuild" | bc)x; $same"
    echo "  $summary"
    echo "  dry run: $(grep -E '^(changed lines|[0-9]+ block)' "$work/dry.log" || true)"
    [[ "$same" == "same sigma bits" ]] || exit 1
done
echo "load after: $(cut -d' ' -f1-3 /proc/loadavg)"
