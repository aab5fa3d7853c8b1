#!/usr/bin/env bash
# Benchmark (run by hand, figures in docs/performance.md): `linewright sigma` end to end (JVM start included) with the
# fast and the exact engine on 1,000,000 lines made from the real samples (CO2, N2O, PH3 records in 480-920 cm-1,
# cycled and jittered by +-0.3 cm-1), 200,001 points over 500-900 cm-1, 5 cm-1 cutoff, 1 atm air, 296 K — against a
# vectorised NumPy + scipy.special.wofz direct summation (tools/direct-sum-reference.py) of 100,000 of the same lines
# (every tenth), scaled by 10 (its cost is linear in the lines). Also: the fast engine against the exact one at every
# point, and the exact engine against NumPy on the 100,000-line subset. Needs python3 with numpy and scipy.
#
#     tools/bench-sigma-vs-numpy.sh [WORK_DIR]      (default /tmp/linewright-bench-numpy)
set -euo pipefail
cd "$(dirname "$(readlink -f "$0")")/.."
work="${1:-/tmp/linewright-bench-numpy}"
samples=../shared/reference-data/hitran2020-samples
mkdir -p "$work"
lines="${LINEWRIGHT_BENCH_LINES:-1000000}"
if [[ ! -s "$work/list.par" ]]; then
    python3 tools/jitter-sample.py "$work/list.par" "$lines" 480 920 0.3 \
        "$samples/sample_CO2.par" "$samples/sample_N2O.par" "$samples/sample_PH3.par"
    awk 'NR % 10 == 1' "$work/list.par" > "$work/tenth.par"
fi
./linewright --version >/dev/null   # builds the tool when needed (not timed)
rm -rf "$work/store" "$work/store-tenth"
./linewright ingest "$work/list.par" --store "$work/store" --quiet
./linewright ingest "$work/tenth.par" --store "$work/store-tenth" --quiet
# The list holds three molecules: sigma needs declared mixing ratios; with equal ratios sigma_mix = (sum over all
# lines) / 3, so the comparisons below multiply linewright's sigma by 3 (NumPy sums the lines as they are).
common=(--temperature 296 --pressure 1atm --background air=1 --between 500 900 --step 0.002 --cutoff 5
        --vmr CO2=1,N2O=1,PH3=1 --quiet)
seconds() { local s e; s=$(date +%s.%N); "$@"; e=$(date +%s.%N); echo "$e - $s" | bc; }
echo "machine: $(nproc) cores, $(java -version 2>&1 | head -n 1); load $(cut -d' ' -f1-3 /proc/loadavg)"
# timed runs write Arrow IPC (the table format); the CSV copies for the comparison below are not timed
fast=$(seconds ./linewright sigma "$work/store" --engine fast --out "$work/fast.arrow" "${common[@]}")
exact=$(seconds ./linewright sigma "$work/store" --engine exact --out "$work/exact.arrow" "${common[@]}")
fast2=$(seconds ./linewright sigma "$work/store" --engine fast --out "$work/fast.arrow" "${common[@]}")
./linewright sigma "$work/store" --engine fast --format csv --out "$work/fast.csv" "${common[@]}"
./linewright sigma "$work/store" --engine exact --format csv --out "$work/exact.csv" "${common[@]}"
./linewright sigma "$work/store-tenth" --engine exact --format csv --out "$work/exact-tenth.csv" "${common[@]}"
numpy_out=$(python3 tools/direct-sum-reference.py "$work/tenth.par" --between 500 900 --step 0.002 --cutoff 5 \
    --pressure-atm 1 --out "$work/numpy-tenth.csv")
echo "numpy: $numpy_out"
numpy_tenth=$(echo "$numpy_out" | sed -n 's/.*summation \([0-9.]*\) s.*/\1/p')
python3 - "$work" "$fast" "$fast2" "$exact" "$numpy_tenth" <<'PY'
import sys, numpy as np
work, fast, fast2, exact, numpy_tenth = sys.argv[1], float(sys.argv[2]), float(sys.argv[3]), float(sys.argv[4]), float(sys.argv[5])
def load(name, factor=3.0):
    return factor * np.loadtxt(f'{work}/{name}', delimiter=',', skiprows=1)[:, 1]
f, e = load('fast.csv'), load('exact.csv')
m = e >= 1e-6 * e.max()
print(f'fast vs exact at all {len(e)} points: worst relative {np.max(np.abs(f[m] - e[m]) / e[m]):.2e} where sigma >= 1e-6 max, '
      f'worst absolute {np.max(np.abs(f - e)) / e.max():.2e} of max')
et, nt = load('exact-tenth.csv'), load('numpy-tenth.csv', 1.0)
mt = et >= 1e-6 * et.max()
print(f'exact vs numpy (100,000 lines): worst relative {np.max(np.abs(et[mt] - nt[mt]) / et[mt]):.2e} where sigma >= 1e-6 max '
      '(masses and constants differ slightly between the two)')
numpy_full = 10 * numpy_tenth
best_fast = min(fast, fast2)
print(f'numpy direct sum, 10^6 lines (10 x {numpy_tenth:.1f} s): {numpy_full:.1f} s')
print(f'linewright sigma --engine fast (end to end, JVM start included, Arrow output): {fast:.2f} s, {fast2:.2f} s -> {numpy_full / best_fast:.0f}x numpy')
print(f'linewright sigma --engine exact (end to end, Arrow output): {exact:.2f} s -> {numpy_full / exact:.0f}x numpy')
PY
