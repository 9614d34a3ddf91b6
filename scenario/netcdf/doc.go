// Package netcdf writes NetCDF classic-format files: CDF-1 (classic) and
// CDF-2 (64-bit offset), as defined by Unidata's "NetCDF Classic and 64-bit
// Offset Format" specification (the BNF grammar of the netCDF User's Guide,
// appendix "File Format Specification"). It is a writer only, of murk's
// own; files are read back in tests by Unidata's ncdump and by Python's
// netCDF4 and xarray.
//
// # Model
//
// A file is a [Header] (dimensions, global attributes, variables with
// their attributes, and the number of records) followed by the data. At
// most one dimension is unlimited (the record dimension); a variable whose
// first dimension is the unlimited one is a record variable. Data follow
// the header in file order: every fixed-size variable in the order of
// Header.Vars, then NumRecs records, each holding one slab of every record
// variable in order. Because the header carries the record count and every
// variable's offset, the writer computes the whole layout up front, so
// NumRecs must be known when the file is begun (the run knows its output
// times). That lets the [Writer] stream to any io.Writer, such as the
// temporary file of package safefile, with no seeking and with memory
// bounded by the caller's chunk size.
//
// # Use
//
//	err := netcdf.Create(path, h, func(w *netcdf.Writer) error {
//		// fixed-size variables, then record by record:
//		return w.WriteFloat64s("bb", values) // any number of chunks
//	})
//
// [Create] is atomic: on any error no file and no temporary file remain.
// [Writer.Next] reports which variable and record are due, so that generic
// code can drive the writer. Package cf, below this one, adds the CF
// conventions (coordinate variables, units, standard names, time).
//
// # Encoding details (all from the specification)
//
//   - Big-endian throughout; IEEE 754 floats; names and text are
//     length-prefixed and padded to 4 bytes with NUL bytes.
//   - Each variable's data (each record slab of a record variable) is
//     padded to 4 bytes with the variable's fill value: its _FillValue
//     attribute, else the default of its type ([FillByte] … [FillDouble]).
//     When there is exactly one record variable, records are not padded.
//   - vsize is the padded size of a variable (per record); the last
//     fixed-size variable of a file without record variables may exceed
//     2^32 − 4 bytes, with vsize written as 2^32 − 1.
//   - Data start right after the header, with no reserved header space,
//     as the reference library does by default (nc_enddef).
//
// The writer's output is byte-for-byte identical to what Unidata's ncgen
// (netcdf-bin 4.9.0) builds from the same CDL, for the cases in testdata.
//
// # Validity and limits
//
// Dimension lengths are 1 to 2^31 − 1 (the record count 0 to 2^31 − 1).
// CDF-1 offsets must stay below 2^31 bytes, so files over 2 GiB need CDF2.
// Names are restricted to the portable subset: an ASCII letter or
// underscore, then letters, digits and _.-+@ (the format allows more UTF-8
// names; CF recommends this subset). Attributes of type char hold UTF-8
// text; numeric attributes need at least one value. Floating-point data and
// attributes must be finite: NaN is accepted only where it is the
// variable's _FillValue; write missing data as the _FillValue. Errors name
// the variable, the record and the value index. A Writer is not safe for
// concurrent use.
package netcdf
