package scenario

// WriteOutputs writes the products the scenario asks for (Outputs: CSV
// tables, NetCDF, figures, the summary) into dir and
// returns the paths written, in a fixed order (CSV, NetCDF, figures,
// summary). A scenario that lists no
// product gets CSV tables and the summary.
func (r *Result) WriteOutputs(dir string) ([]string, error) {
	o := r.Scenario.Outputs
	if !o.CSV && !o.NetCDF && !o.Plots && !o.Summary {
		o.CSV, o.Summary = true, true
	}
	var out []string
	if o.CSV {
		p, err := r.WriteCSV(dir)
		out = append(out, p...)
		if err != nil {
			return out, err
		}
	}
	if o.NetCDF {
		p, err := r.writeNetCDFInto(dir)
		if err != nil {
			return out, err
		}
		out = append(out, p)
	}
	if o.Plots {
		p, err := r.WritePlots(dir)
		out = append(out, p...)
		if err != nil {
			return out, err
		}
	}
	if o.Summary {
		p, err := r.WriteSummaryFile(dir)
		if err != nil {
			return out, err
		}
		out = append(out, p)
	}
	return out, nil
}
