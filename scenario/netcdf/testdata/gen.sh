#!/bin/sh
# Regenerates the reference files of the byte-for-byte tests from their CDL
# text with Unidata's ncgen (Debian package netcdf-bin). Run from this
# directory: sh gen.sh
set -e
for f in fixed record single attronly; do
	ncgen -k classic -o "$f.cdf1.nc" "$f.cdl"
	ncgen -k 64-bit-offset -o "$f.cdf2.nc" "$f.cdl"
done
