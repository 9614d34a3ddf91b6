// Package cf builds NetCDF files that follow the CF Metadata Conventions,
// version 1.8 (Eaton et al., "NetCDF Climate and Forecast (CF) Metadata
// Conventions", cfconventions.org), on top of the classic-format writer of
// package netcdf.
//
// A [Dataset] is defined first, then written:
//
//   - global attributes (section 2.6): Conventions = "CF-1.8", title, and
//     optionally institution, source, history, references, comment;
//   - a time coordinate (section 4.4) in seconds since an epoch, units
//     "seconds since YYYY-MM-DD hh:mm:ss" (UTC), calendar "standard",
//     axis "T", either the unlimited (record) dimension or a fixed one;
//   - coordinate variables (section 5): one-dimensional, named as their
//     dimension, strictly monotonic, with units, long_name, and optionally
//     standard_name, axis and positive;
//   - labelled dimensions (section 6.1), e.g. particle populations or
//     stations: a char variable NAME_name holds one label per index;
//   - data variables with units (UDUNITS syntax, "1" if dimensionless),
//     long_name, standard_name where the CF Standard Name Table has one
//     (constants Std… below), and optionally _FillValue equal to the
//     format's default fill value of the variable's type.
//
// Definition errors accumulate: [Dataset.Header] reports all of them at
// once, each naming the item, the value and what is allowed. [Create]
// writes the file atomically; its [Writer] writes the coordinate values
// itself as they fall due, so the caller streams only the data variables,
// in file order (fixed-size variables, then record by record).
//
// For a run that produces its outputs time step by time step, make time
// Unlimited: each output time is then one record, written before the next
// is computed, so no more than one time step need be held in memory.
//
// Units are not checked against the standard names' canonical units; the
// caller states them. Missing data are written as the _FillValue
// (netcdf.FillFloat, netcdf.FillDouble …); NaN data are refused.
package cf
