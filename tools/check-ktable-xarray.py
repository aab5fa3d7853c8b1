"""Opens a linewright k-table (HDF5) with xarray (Debian's python3-xarray), with its default back end (netCDF4) and
with h5netcdf, and checks what a user of either sees: k_cm2_per_molecule has the dimensions (pressure_bar,
temperature_K, bin, g), the axes are coordinates with their units, the g weights sum to 1, and every k equals an
independent NumPy computation from the sigma table it was made from (read with xarray too): per bin the sorted sigma
values as a step function of g (each point 1/n of the bin), averaged over the g-interval of each Gauss-Legendre
weight, nodes and weights from numpy.polynomial.legendre.leggauss mapped to [0, 1].

Usage: /usr/bin/python3 check-ktable-xarray.py KTABLE.h5 SIGMA_TABLE.h5 G_POINTS
A missing reader module is skipped with a message (exit 0); a disagreement exits 1."""
import importlib.util
import sys

K = "k_cm2_per_molecule"
DIMS = ("pressure_bar", "temperature_K", "bin", "g")
UNITS = {"pressure_bar": "bar", "temperature_K": "K", "g": "1", "g_weight": "1", "bin_lower_cm1": "cm-1",
         "bin_upper_cm1": "cm-1", "bin_centre_cm1": "cm-1", K: "cm2/molecule"}


def fail(msg):
    sys.exit("xarray (k-table): " + msg)


def interval_means(sorted_values, edges):
    """Mean over [edges[i], edges[i+1]) of the step function g -> sorted_values[floor(g n)]."""
    import numpy as np
    n = len(sorted_values)
    cumulative = np.concatenate(([0.0], np.cumsum(sorted_values))) / n

    def integral(x):
        j = np.minimum((x * n).astype(int), n - 1)
        return cumulative[j] + (x - j / n) * sorted_values[j]

    return (integral(edges[1:]) - integral(edges[:-1])) / (edges[1:] - edges[:-1])


def main():
    ktable, sigma_table, points = sys.argv[1], sys.argv[2], int(sys.argv[3])
    if importlib.util.find_spec("xarray") is None:
        print("readers: SKIPPED the xarray k-table check (python3-xarray is not installed)")
        return 0
    import numpy as np
    import xarray as xr

    x, w = np.polynomial.legendre.leggauss(points)
    nodes, weights = (x + 1) / 2, w / 2
    edges = np.concatenate(([0.0], np.cumsum(weights)))
    edges[-1] = 1.0
    engines = []
    for engine, module, package in (("default", "netCDF4", "python3-netcdf4"), ("h5netcdf", "h5netcdf", "python3-h5netcdf")):
        if importlib.util.find_spec(module) is None:
            print(f"readers: SKIPPED the k-table with the {engine} back end ({package} is not installed)")
        else:
            engines.append(engine)
    with xr.open_dataset(sigma_table) as st:
        sigma = st["cross_section_cm2_per_molecule"].values
        nu = st["wavenumber_cm1"].values
    for engine in engines:
        with (xr.open_dataset(ktable) if engine == "default" else xr.open_dataset(ktable, engine=engine)) as ds:
            where = f"engine {engine}: "
            k = ds[K]
            if k.dims != DIMS:
                fail(where + f"{K} has dimensions {k.dims}, expected {DIMS}")
            for name in ("pressure_bar", "temperature_K", "g"):
                if name not in ds.coords or ds[name].dims != (name,):
                    fail(where + f"{name} is not a dimension coordinate")
            for name, unit in UNITS.items():
                if ds[name].attrs.get("units") != unit:
                    fail(where + f"{name} has units {ds[name].attrs.get('units')!r}, expected {unit!r}")
            if not np.allclose(ds["g"].values, nodes, rtol=0, atol=1e-13):
                fail(where + f"g nodes {ds['g'].values} differ from Gauss-Legendre on [0, 1] {nodes}")
            gw = ds["g_weight"].values
            if not np.allclose(gw, weights, rtol=0, atol=1e-13) or abs(gw.sum() - 1) > 1e-12:
                fail(where + f"g weights {gw} (sum {gw.sum()}) differ from Gauss-Legendre {weights}")
            lower, upper = ds["bin_lower_cm1"].values, ds["bin_upper_cm1"].values
            values = k.values
            worst = 0.0
            for b in range(len(lower)):
                last = b == len(lower) - 1
                inside = (nu >= lower[b]) & ((nu < upper[b]) | last)
                for p in range(sigma.shape[0]):
                    for t in range(sigma.shape[1]):
                        expected = interval_means(np.sort(sigma[p, t, inside]), edges)
                        got = values[p, t, b]
                        scale = max(expected.max(), 1e-300)
                        worst = max(worst, float(np.max(np.abs(got - expected)) / scale))
            if worst > 1e-9:
                fail(where + f"k differs from the NumPy interval means by {worst:.2e} of the bin's largest k")
            print(f"readers: xarray ({engine}) opens the k-table: {K}{k.dims}, {values.size} values agree with "
                  f"NumPy's interval means to {worst:.1e}")
    return 0


if __name__ == "__main__":
    sys.exit(main())
