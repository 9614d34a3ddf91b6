"""Reads a murk run's NetCDF file with netCDF4 and xarray, prints JSON.

Usage: /usr/bin/python3 readback.py FILE.nc

Exits with status 3 if a module is missing. Used by TestNetCDFReadBack
(netcdf_test.go): netCDF4 (Unidata's Python interface to the netCDF C
library) gives raw values, dimensions and attributes; xarray decodes the CF
time coordinate.
"""
import json
import sys

try:
    import netCDF4
    import xarray as xr
except ImportError as e:
    print(e, file=sys.stderr)
    sys.exit(3)

path = sys.argv[1]
out = {}
with netCDF4.Dataset(path) as ds:
    out["dims"] = {k: len(v) for k, v in ds.dimensions.items()}
    out["conventions"] = ds.getncattr("Conventions")
    out["salinity"] = [float(x) for x in ds.variables["salinity"][:].ravel()]
    out["bb"] = [float(x) for x in ds.variables["bb"][:].ravel()]
    out["component_a"] = [float(x) for x in ds.variables["component_a"][:].ravel()]
    out["bb_standard_name"] = ds.variables["bb"].standard_name
    out["bb_units"] = ds.variables["bb"].units
    out["layers"] = ["".join(c.decode() for c in row if c) for row in ds.variables["layer_name"][:].filled(b"")]
with xr.open_dataset(path) as x:
    t = x["time"].values
    out["time_hours"] = [float((v - t[0]) / 3.6e12) for v in t]
print(json.dumps(out))
