package mie_test

import (
	"fmt"
	"math"

	"github.com/murk-optics/murk/mie"
)

// A mineral grain of 2 µm diameter in water (index 1.56 relative to air,
// 1.334 for water) at 550 nm.
func ExampleSphere() {
	x := mie.SizeParameter(2e-6, 550e-9, 1.334)
	e, err := mie.Sphere(x, complex(1.56/1.334, 0.001/1.334))
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("x=%.3f Qext=%.4f Qsca=%.4f Qbb=%.5f b_b/b=%.4f g=%.4f\n",
		x, e.Qext, e.Qsca, e.Qbb, e.BackscatteringRatio(), e.G)
	// Output:
	// x=15.240 Qext=3.1355 Qsca=3.0955 Qbb=0.04935 b_b/b=0.0159 g=0.9287
}

// A phytoplankton-like cell: absorbing chloroplast core inside a watery
// cytoplasm shell, 6 µm across, at 675 nm in water.
func ExampleCoated() {
	x := mie.SizeParameter(6e-6, 675e-9, 1.331)
	xc := mie.SizeParameter(3e-6, 675e-9, 1.331)
	e, err := mie.Coated(xc, x, complex(1.10, 0.01), complex(1.02, 0.0005))
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("Qext=%.4f Qabs=%.4f b_b/b=%.5f\n", e.Qext, e.Qabs, e.BackscatteringRatio())
	// Output:
	// Qext=1.4163 Qabs=0.1528 b_b/b=0.00055
}

// The volume scattering function of 1e9 spheres per cubic metre at a few
// angles, reusing one Solver.
func ExampleSolver_VolumeScattering() {
	var s mie.Solver
	x := mie.SizeParameter(1e-6, 532e-9, 1.334)
	if _, err := s.Sphere(x, 1.17); err != nil {
		fmt.Println(err)
		return
	}
	angles := []float64{10, 90, 117, 170}
	mu := make([]float64, len(angles))
	for i, a := range angles {
		mu[i] = math.Cos(a * math.Pi / 180)
	}
	beta := make([]float64, len(mu))
	s.VolumeScattering(mu, 1e9, 532e-9, 1.334, beta)
	for i, a := range angles {
		fmt.Printf("β(%3.0f°) = %.4g m⁻¹ sr⁻¹\n", a, beta[i])
	}
	// Output:
	// β( 10°) = 0.006461 m⁻¹ sr⁻¹
	// β( 90°) = 7.08e-06 m⁻¹ sr⁻¹
	// β(117°) = 4.401e-06 m⁻¹ sr⁻¹
	// β(170°) = 7.178e-07 m⁻¹ sr⁻¹
}
