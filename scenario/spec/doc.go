// Package spec reads murk scenario files: YAML documents that describe an
// estuary (geometry, river, tide, ocean, closures, sediment classes, run),
// the particles and water in it (water, populations, optics) and what a run
// writes (outputs). It checks every value strictly and returns a plain Go
// value in SI units, or the full list of problems with their positions.
//
// # Documents
//
// One schema serves three documents:
//
//   - a scenario (Load, Parse): every section;
//   - an estuary document (LoadEstuary): geometry, river, tide, ocean,
//     closures, sediment_classes, run;
//   - a mixture document (LoadMixture): water, populations, optics.
//
// version (must be 1), name and description may head any of them. A
// section outside the document's set is an error that says which document
// it belongs to. testdata/quell.yaml is a complete, commented scenario.
//
// # Sections and keys
//
// Required keys are marked *; "a | b" is a choice of forms.
//
//	geometry        length*, cells*, and either width* ("500 m" | {mouth*, convergence_length*})
//	                with depth*, or table* [{distance, width, depth}, ...]
//	river           discharge* ("150 m3/s" | {series*: [{time, value}, ...], max_gap}),
//	                temperature*, sediment {<class>: "20 g/m3" | {a*, b*, reference_discharge}}
//	tide            m2* {range | velocity}, s2 {range | velocity}
//	ocean           salinity*, temperature*, sediment {<class>: "5 g/m3"}
//	closures        drag_coefficient, mixing_coefficient, background_mixing,
//	                dispersion_coefficient, interfacial_friction, erosion_rate,
//	                critical_stress_erosion, critical_stress_deposition, bed_inventory
//	sediment_classes [{name*, settling_velocity* ("0.5 mm/s" | floc), and the four bed keys}]
//	water           cdom {river*, ocean*, reference_wavelength, slope},
//	                chlorophyll {river*, ocean*}; mixture documents also
//	                salinity*, temperature*, ocean_salinity
//	populations     [{name*, kind* (mineral | organic | phytoplankton | floc), composition,
//	                density*, refractive_index*, size*, concentration | class (+ class_fraction),
//	                floc (kind floc: primary_size*, fractal_dimension*, optics, dynamic),
//	                cell (kind phytoplankton: structure, core_fraction, shell_index)}]
//	refractive_index relative_to* (water | vacuum), model* (constant: n*, k |
//	                table: table* [{wavelength, n, k}] | smooth: n*, wavelength_ref*,
//	                k_ref*, k_slope*, cauchy_b, k_floor)
//	size            kind* (junge: slope*, dmin*, dmax* | lognormal: median*, gsd*,
//	                by* (number | volume) | table: csv*)
//	optics          wavelengths* (["440 nm", ...] | {from*, to*, step*}), angles,
//	                size_bins, instruments [{name*, kind* (transmissometer: wavelength*,
//	                path_length*, acceptance_angle* | backscatter: wavelength*, angle* |
//	                turbidity)}]
//	run             duration*, output_interval*, spin_up, stations
//	outputs         directory, products (netcdf, csv, plots, summary), plot_formats (svg, png)
//
// # Values and units
//
// Every dimensional value is a string with a number and a unit: "1200 m3/s",
// "25 km", "650 nm", "0.5 mm/s", "30 day", "12 degC", "35 PSU", "50 g/m3" or
// "50 mg/L". Dimensionless values (fractal dimension, Junge slope,
// refractive index, drag coefficient, rating exponent) are plain YAML
// numbers. Each field accepts a fixed list of units, printed in its error
// messages; a missing, unknown or wrong-dimension unit is an error. The unit
// symbols follow the SI Brochure (BIPM, 9th ed., 2019) written in ASCII:
// "m3" for m³, "um" or "µm" for micrometre, "1/m" or "m-1" for m⁻¹. Values
// are converted to SI on reading (ParseQuantity exposes the converter):
//
//	length, diameter, wavelength  m        time                  s
//	velocity                      m/s      discharge             m³/s
//	mass concentration, density   kg/m³    number concentration  1/m³
//	volume concentration          m³/m³    stress                Pa
//	erosion rate                  kg/m²/s  bed inventory         kg/m²
//	absorption, spectral slope    1/m      angle                 rad
//	diffusivity                   m²/s     Cauchy coefficient    m²
//
// Two exceptions follow the conventions of the oceanographic equations murk
// uses: temperature is kept in °C (an SI derived unit; "K" is accepted and
// converted) and salinity is practical salinity (PSU, dimensionless; UNESCO
// 1981). A particle concentration's unit also sets its basis: mass ("g/m3",
// "mg/L"), volume ("µL/L") or number ("1/mL").
//
// Distance x is measured from the mouth (x = 0, the sea) landward to the
// head (x = geometry.length). Run time is 0 at the start of spin-up; outputs
// begin after spin-up. Time series give times on that clock.
//
// # Validation
//
// The document is decoded once into a yaml.Node tree and walked by hand, so
// that unknown keys, repeated keys, wrong types, out-of-range values and
// inconsistent combinations are all reported with the node's line and
// column (yaml.v3's KnownFields does not apply to node decoding). Every
// problem is collected: a failed document returns an ErrorList of *Error,
// each naming file:line:column, the field path (populations[1].size.median),
// the value as written and the allowed range with its unit. YAML syntax
// errors carry a line only (the parser reports no column). YAML aliases are
// rejected, so that a small file cannot expand without bound. The checks
// across fields include: dmin < dmax; 1 < fractal dimension ≤ 3; floc
// primaries smaller than the flocs; a tide that does not dry the mouth; no
// zero river discharge without a tide; time series strictly increasing,
// without gaps (max_gap) and covering the run; output interval ≤ duration;
// stations on the channel; geometry tables from the mouth to the head;
// refractive-index tables covering the optics wavelengths; instrument
// wavelengths inside the optics range; population class fractions summing to
// at most 1 per class; exactly one floc population on a class that settles as
// flocs; deposition threshold ≤ erosion threshold.
//
// # Defaults
//
// Optional keys take these values when absent (source in brackets):
//
//	tide                          none (no tide)
//	tide.s2                       none (no spring–neap cycle)
//	closures.*, sediment class bed keys
//	                              unset: the estuary model's own published
//	                              defaults (package mixing documents them);
//	                              a class's bed keys fall back to closures
//	river.sediment.<class>        0 (the river brings none of that class)
//	rating reference_discharge    1 m³/s (so C = a·Q^b with Q in m³/s)
//	ocean.sediment.<class>        0
//	series max_gap                1.5 × the median sampling interval (a design
//	                              choice: catches one missing sample)
//	run.spin_up                   0
//	run.stations                  every cell centre
//	water                         no CDOM, no chlorophyll
//	water.cdom.reference_wavelength  440 nm [common practice]
//	water.cdom.slope              0.0176 nm⁻¹ [Babin et al. 2003, J. Geophys.
//	                              Res. 108(C7):3211, mean of European coastal waters]
//	water.ocean_salinity          35 PSU, mixture documents only [common
//	                              practice: open-ocean surface]; in a scenario it
//	                              is ocean.salinity
//	refractive_index k            0 (constant model)
//	refractive_index cauchy_b, k_floor  0 (smooth model)
//	population class_fraction     1
//	floc.optics                   "" = the floc package's documented default
//	floc.dynamic                  true in a scenario, false in a mixture document
//	cell.structure                homogeneous
//	optics.angles                 90°, 100°, …, 170° [the angles of the χ_p table
//	                              of Sullivan et al. 2013, Light Scattering Reviews 7]
//	optics.size_bins              200 [the kernel size the particle optics are
//	                              benchmarked at]
//	outputs                       directory "murk-out" beside the scenario file;
//	                              products netcdf, csv, plots, summary; plot
//	                              formats svg, png
//
// # Cost
//
// Estimate, EstimateEstuary and EstimateMixture count the work a scenario
// asks for (cell-steps of the estuary model, Lorenz–Mie series terms of the
// optical kernels, kernel products and values written), for a check command
// to print before a long run. They count operations, not seconds.
package spec
