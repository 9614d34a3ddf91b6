// Package mixing is a width-averaged, two-layer, finite-volume estuary model.
package mixing
