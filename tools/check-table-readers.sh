#!/usr/bin/env bash
# Reads linewright tables with readers that share no code with linewright, and checks them against each other:
#   - an Arrow table with Arrow JS (npm package apache-arrow, installed into a temporary folder, run with node),
#   - an HDF5 table of the same build with h5dump (Debian hdf5-tools) or, failing that, h5py,
#   - the HDF5 table as netCDF-4 with xarray (python3-xarray, default back end netCDF4 and h5netcdf): dimensions,
#     coordinates, units, chunking and compression, every value against the Arrow table (check-table-xarray.py),
#   - a k-table made from that HDF5 table, with xarray, every k against NumPy (check-ktable-xarray.py),
#   - both files' sidecar checksums with sha256sum -c, and sigma_sha256 recomputed from the values read.
# The two tables come from `linewright build` on a small plan over the SYNTHETIC demo lines; the Arrow and HDF5
# values must agree bit for bit (printed with 17 significant digits). A reader that is missing is skipped with a
# message; the script fails only on a real disagreement. Run after `./mvnw -B verify` (the launcher rebuilds).
set -euo pipefail
root="$(cd "$(dirname "$(readlink -f "$0")")/.." && pwd)"
work="$(mktemp -d "${TMPDIR:-/tmp}/linewright-readers.XXXXXX")"
trap 'rm -rf "$work"' EXIT
ARROW_JS_VERSION=21.2.0
# Debian's python3-h5py lives in Debian's interpreter; a python3 earlier on PATH (pyenv, a venv) would not see it.
PY=python3
[[ -x /usr/bin/python3 ]] && PY=/usr/bin/python3

for fmt in arrow h5; do
    cat > "$work/plan-$fmt.toml" <<PLAN
# SYNTHETIC lines (the demo's invented CO list); a small table for reader checks
[lines]
sources = ["$root/demo/data/synthetic-co.par.bz2"]
[grid]
wavenumber = { from = 2100.0, to = 2200.0, step = 0.05 }
pressures_bar = [0.01, 1.0]
temperatures_K = [500.0, 1000.0]
[background]
H2 = 0.85
He = 0.15
[profile]
cutoff_cm1 = 10.0
[build]
block_points = 700
[output]
table = "table.$fmt"
PLAN
    "$root/linewright" -q build "$work/plan-$fmt.toml"
    (cd "$work" && sha256sum -c --quiet "table.$fmt.sha256")
done
echo "readers: sidecar checksums ok"

checked=0
if command -v node >/dev/null 2>&1 && command -v npm >/dev/null 2>&1 \
        && npm install --silent --no-audit --no-fund --prefix "$work/js" "apache-arrow@$ARROW_JS_VERSION" >/dev/null 2>&1; then
    ARROW_MODULE_DIR="$work/js/node_modules" node "$root/tools/read-table-arrow.mjs" "$work/table.arrow" > "$work/arrow.txt"
    checked=$((checked + 1))
else
    echo "readers: SKIPPED the Arrow JS check (node/npm or the apache-arrow package is not available)"
fi

h5=""
if command -v h5dump >/dev/null 2>&1; then
    "$PY" - "$work" <<'PY'
import subprocess, sys, re, struct, hashlib
work = sys.argv[1]
def data(name, fmt="%.17g"):
    out = subprocess.run(["h5dump", "-d", name, "-m", fmt, "-y", "-w", "0", work + "/table.h5"],
                         capture_output=True, text=True, check=True).stdout
    start = out.index("DATA {") + 6
    body = out[start: out.index("}", start)]
    return [float(x) for x in re.split(r"[\s,]+", body.strip()) if x]
nu, p, t = data("/wavenumber_cm1"), data("/pressure_bar"), data("/temperature_K")
s = data("/cross_section_cm2_per_molecule")
attr = subprocess.run(["h5dump", "-a", "/sigma_sha256", work + "/table.h5"], capture_output=True, text=True, check=True).stdout
expected = re.search(r'"([0-9a-f]{64})"', attr).group(1)
actual = hashlib.sha256(b"".join(struct.pack("<d", v) for v in s)).hexdigest()
if expected != actual:
    sys.exit(f"h5dump: sigma_sha256 mismatch: attribute {expected}, values {actual}")
with open(work + "/h5.txt", "w") as f:
    k = 0
    for pi in p:
        for ti in t:
            for n in nu:
                f.write(f"{pi!r} {ti!r} {n!r} {s[k]!r}\n"); k += 1
print(f"h5dump: {len(p)}x{len(t)}x{len(nu)} values, sigma_sha256 ok", file=sys.stderr)
PY
    h5="h5dump"
elif "$PY" -c "import h5py" >/dev/null 2>&1; then
    "$PY" - "$work" <<'PY'
import sys, struct, hashlib, h5py
work = sys.argv[1]
with h5py.File(work + "/table.h5", "r") as f:
    nu, p, t = f["wavenumber_cm1"][()], f["pressure_bar"][()], f["temperature_K"][()]
    s = f["cross_section_cm2_per_molecule"][()]
    expected = f.attrs["sigma_sha256"]
    expected = expected.decode() if isinstance(expected, bytes) else str(expected)
flat = [float(v) for v in s.reshape(-1)]
if hashlib.sha256(b"".join(struct.pack("<d", v) for v in flat)).hexdigest() != expected:
    sys.exit("h5py: sigma_sha256 mismatch")
with open(work + "/h5.txt", "w") as out:
    k = 0
    for pi in p:
        for ti in t:
            for n in nu:
                out.write(f"{float(pi)!r} {float(ti)!r} {float(n)!r} {flat[k]!r}\n"); k += 1
PY
    h5="h5py"
else
    echo "readers: SKIPPED the HDF5 check (neither h5dump nor h5py is installed)"
fi
[[ -n "$h5" ]] && checked=$((checked + 1))

if [[ -s "$work/arrow.txt" && -s "$work/h5.txt" ]]; then
    "$PY" - "$work" <<'PY'
import sys
work = sys.argv[1]
a = [tuple(float(x) for x in l.split()) for l in open(work + "/arrow.txt")]
h = [tuple(float(x) for x in l.split()) for l in open(work + "/h5.txt")]
if len(a) != len(h):
    sys.exit(f"readers: Arrow has {len(a)} rows, HDF5 {len(h)}")
bad = [i for i, (x, y) in enumerate(zip(a, h)) if x != y]
if bad:
    sys.exit(f"readers: {len(bad)} rows differ, first {a[bad[0]]} vs {h[bad[0]]}")
if not any(r[3] > 0 for r in a):
    sys.exit("readers: every sigma is zero")
print(f"readers: Arrow JS and HDF5 agree on all {len(a)} values")
PY
fi
# xarray reads the HDF5 table as netCDF-4; axes as in the plan above, values as Arrow JS printed them
if "$PY" -c "import xarray" >/dev/null 2>&1; then
    rows=-
    [[ -s "$work/arrow.txt" ]] && rows="$work/arrow.txt"
    "$PY" "$root/tools/check-table-xarray.py" "$work/table.h5" "$rows" 0.01,1.0 500.0,1000.0 2100.0,2200.0,2001
    checked=$((checked + 1))
    # the k-table made from the HDF5 table, checked against NumPy from the same sigma values
    "$root/linewright" -q ktable "$work/table.h5" --bin-width 10 --g-points 8 --out "$work/ktable.h5"
    "$PY" "$root/tools/check-ktable-xarray.py" "$work/ktable.h5" "$work/table.h5" 8
    checked=$((checked + 1))
else
    echo "readers: SKIPPED the xarray checks (python3-xarray is not installed for $PY)"
fi
echo "readers: $checked independent reader(s) checked"
