"""Opens a linewright HDF5 table with xarray (Debian's python3-xarray), with its default back end (netCDF4) and
with h5netcdf, and checks what a user of either sees: sigma's dimensions are the three axes, the axes are
coordinates with their values and units, sigma is chunked and deflated, and sigma's values equal those the Arrow
JS reader printed from the Arrow table of the same build (bit for bit, every value).

Usage: /usr/bin/python3 check-table-xarray.py TABLE.h5 ARROW_ROWS.txt|- P1,P2,.. T1,T2,.. NU_FROM,NU_TO,NU_COUNT
A missing reader module is skipped with a message (exit 0); a disagreement exits 1."""
import importlib.util
import sys

SIGMA = "cross_section_cm2_per_molecule"
DIMS = ("pressure_bar", "temperature_K", "wavenumber_cm1")
CHUNK_POINTS = 16384  # TableWriter.HDF5_CHUNK_POINTS
UNITS = {"pressure_bar": "bar", "temperature_K": "K", "wavenumber_cm1": "cm-1", SIGMA: "cm2/molecule"}


def fail(msg):
    sys.exit("xarray: " + msg)


def main():
    table, arrow_rows = sys.argv[1], sys.argv[2]
    expect_p = [float(x) for x in sys.argv[3].split(",")]
    expect_t = [float(x) for x in sys.argv[4].split(",")]
    nu_from, nu_to, nu_count = sys.argv[5].split(",")
    if importlib.util.find_spec("xarray") is None:
        print("readers: SKIPPED the xarray check (python3-xarray is not installed)")
        return 0
    import numpy as np
    import xarray as xr

    rows = None
    if arrow_rows != "-":
        rows = np.loadtxt(arrow_rows, ndmin=2)
    engines = []
    for engine, module, package in (("default", "netCDF4", "python3-netcdf4"), ("h5netcdf", "h5netcdf", "python3-h5netcdf")):
        if importlib.util.find_spec(module) is None:
            print(f"readers: SKIPPED xarray with the {engine} back end ({package} is not installed)")
        else:
            engines.append(engine)
    for engine in engines:
        with (xr.open_dataset(table) if engine == "default" else xr.open_dataset(table, engine=engine)) as ds:
            where = f"engine {engine}: "
            s = ds[SIGMA]
            if s.dims != DIMS:
                fail(where + f"{SIGMA} has dimensions {s.dims}, expected {DIMS}")
            for name in DIMS:
                if name not in ds.coords or ds[name].dims != (name,):
                    fail(where + f"{name} is not a dimension coordinate")
            for name, unit in UNITS.items():
                if ds[name].attrs.get("units") != unit:
                    fail(where + f"{name} has units {ds[name].attrs.get('units')!r}, expected {unit!r}")
            if ds["pressure_bar"].values.tolist() != expect_p or ds["temperature_K"].values.tolist() != expect_t:
                fail(where + f"axes {ds['pressure_bar'].values} / {ds['temperature_K'].values}, expected "
                     f"{expect_p} / {expect_t}")
            nu = ds["wavenumber_cm1"].values
            if len(nu) != int(nu_count) or abs(nu[0] - float(nu_from)) > 1e-9 or abs(nu[-1] - float(nu_to)) > 1e-9:
                fail(where + f"wavenumber axis {nu[0]}..{nu[-1]} ({len(nu)} points), expected "
                     f"{nu_from}..{nu_to} ({nu_count})")
            enc = s.encoding
            compressed = enc.get("zlib") or enc.get("compression") == "gzip"
            block = min(len(nu), CHUNK_POINTS)
            if not compressed or not enc.get("shuffle") or tuple(enc.get("chunksizes") or ()) != (1, 1, block):
                fail(where + f"sigma is not chunked (1, 1, {block}) with shuffle and deflate: {enc}")
            if "sigma_sha256" not in ds.attrs or "table_format" not in ds.attrs:
                fail(where + f"root attributes sigma_sha256 / table_format missing: {sorted(ds.attrs)}")
            if importlib.util.find_spec("h5py") is not None:
                import h5py
                with h5py.File(table, "r") as f:
                    if len(f.attrs) != len(ds.attrs):  # the count HDF5 itself reports (H5Oget_info)
                        fail(where + f"HDF5 counts {len(f.attrs)} root attributes, xarray lists {len(ds.attrs)}")
            values = s.values.astype(np.float64)
            if rows is not None:
                grid = rows.reshape(len(expect_p), len(expect_t), len(nu), 4)
                for k, name in enumerate(DIMS):
                    axis = ds[name].values
                    along = [grid[:, 0, 0, 0], grid[0, :, 0, 1], grid[0, 0, :, 2]][k]
                    if not np.array_equal(axis, along):
                        fail(where + f"{name} differs from the Arrow table's")
                if not np.array_equal(values, grid[..., 3]):
                    bad = np.argwhere(values != grid[..., 3])
                    fail(where + f"{len(bad)} sigma values differ from the Arrow table's, first at {tuple(bad[0])}")
                if not (values > 0).any():
                    fail(where + "every sigma is zero")
                print(f"readers: xarray ({engine} back end) sees {SIGMA}{DIMS} with coordinates and units; "
                      f"all {values.size} values equal the Arrow table's")
            else:
                print(f"readers: xarray ({engine} back end) sees {SIGMA}{DIMS} with coordinates and units "
                      "(SKIPPED the comparison with the Arrow table: Arrow JS did not run)")
    return 0


if __name__ == "__main__":
    sys.exit(main())
