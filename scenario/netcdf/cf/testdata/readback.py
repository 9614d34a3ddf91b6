"""Reads a NetCDF file with two independent clients and prints JSON.

Usage: /usr/bin/python3 readback.py FILE.nc

Used by TestReadBackPython (cf_test.go). netCDF4 (Unidata's Python
interface to the netCDF C library) gives the raw values and attributes;
xarray gives CF-decoded values: times as datetime64 from the units and
calendar attributes, _FillValue replaced by NaN.
"""
import json
import math
import sys

import netCDF4
import numpy as np
import xarray as xr


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


path = sys.argv[1]
out = {"netCDF4": {}, "xarray": {}}
with netCDF4.Dataset(path) as ds:
    ds.set_auto_maskandscale(False)
    out["netCDF4"]["format"] = ds.data_model
    out["netCDF4"]["global"] = {k: plain(ds.getncattr(k)) for k in ds.ncattrs()}
    out["netCDF4"]["dims"] = {k: [len(d), d.isunlimited()] for k, d in ds.dimensions.items()}
    out["netCDF4"]["vars"] = {}
    for name, v in ds.variables.items():
        out["netCDF4"]["vars"][name] = {
            "dims": list(v.dimensions),
            "dtype": str(v.dtype),
            "attrs": {k: plain(v.getncattr(k)) for k in v.ncattrs()},
            "values": plain(np.asarray(v[:]).ravel()),
        }
with xr.open_dataset(path) as ds:
    out["xarray"]["time"] = [str(t) for t in ds["time"].values.astype("datetime64[s]")]
    out["xarray"]["vars"] = {
        name: {
            "units": ds[name].attrs.get("units", ds[name].encoding.get("units")),
            "values": plain(ds[name].values.ravel()),
        }
        for name in ds.variables
        if name != "time"
    }
json.dump(out, sys.stdout)
