"""Reads a NetCDF file with two independent clients and prints JSON.

Usage: /usr/bin/python3 readback.py FILE.nc...

Prints a JSON list with one object per file. Exits with status 3 if the
netCDF4 or xarray module is missing. Used by TestReadBackPython
(cf_test.go). netCDF4 (Unidata's Python
interface to the netCDF C library) gives the raw values and attributes;
xarray gives CF-decoded values: times as datetime64 from the units and
calendar attributes, _FillValue replaced by NaN.
"""
import json
import math
import sys

try:
    import netCDF4
    import numpy as np
    import xarray as xr
except ImportError as e:
    print(e, file=sys.stderr)
    sys.exit(3)


def plain(v):
    if isinstance(v, np.ndarray):
        return [plain(x) for x in v.tolist()]
    if isinstance(v, (list, tuple)):
        return [plain(x) for x in v]
    if isinstance(v, (np.floating, float)):
        f = float(v)
        return None if math.isnan(f) else f
    if isinstance(v, np.integer):
        return int(v)
    return v


def read(path):
    out = {"netCDF4": {}, "xarray": {}}
    with netCDF4.Dataset(path) as ds:
        ds.set_auto_maskandscale(False)
        out["netCDF4"]["format"] = ds.data_model
        out["netCDF4"]["global"] = {k: plain(ds.getncattr(k)) for k in ds.ncattrs()}
        out["netCDF4"]["dims"] = {k: [len(d), d.isunlimited()] for k, d in ds.dimensions.items()}
        out["netCDF4"]["vars"] = {}
        for name, v in ds.variables.items():
            entry = {
                "dims": list(v.dimensions),
                "dtype": str(v.dtype),
                "attrs": {k: plain(v.getncattr(k)) for k in v.ncattrs()},
            }
            if v.dtype.kind == "S":  # char array: one string per row
                entry["text"] = [str(s) for s in netCDF4.chartostring(v[:])]
            else:
                entry["values"] = plain(np.asarray(v[:]).ravel())
            out["netCDF4"]["vars"][name] = entry
    with xr.open_dataset(path) as ds:
        out["xarray"]["time"] = [str(t) for t in ds["time"].values.astype("datetime64[s]")]
        out["xarray"]["vars"] = {}
        for name in ds.variables:
            if name == "time":
                continue
            v = ds[name]
            entry = {"units": v.attrs.get("units", v.encoding.get("units"))}
            if v.dtype.kind in "SUO":  # char arrays decoded to strings
                entry["text"] = [s.decode() if isinstance(s, bytes) else str(s) for s in v.values.ravel()]
            else:
                entry["values"] = plain(v.values.ravel())
            out["xarray"]["vars"][name] = entry
    return out


json.dump([read(p) for p in sys.argv[1:]], sys.stdout)
