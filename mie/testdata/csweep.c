/* Plain C reference for the per-term speed of the homogeneous-sphere series:
 * the algorithm of Bohren & Huffman (1983, Appendix A), with the same series
 * length and downward-recurrence start as murk's mie package, in C99 complex
 * arithmetic. It times the benchmark sweep of mie.BenchmarkEfficiencies400
 * (400 sizes log-spaced over x in [0.1, 2000], m = 1.2 + 0.001i).
 *
 *   gcc -O2 -o /tmp/csweep csweep.c -lm && /tmp/csweep
 *
 * Prints ns per series term. Used only to compare speed; not part of the build. */
#include <complex.h>
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <time.h>

static double complex *d;

static double sweep_one(double x, double complex m, long *terms) {
	int nstop = (int)(x + 5.5 * cbrt(x) + 2);
	if (nstop < 2) nstop = 2;
	double complex z = m * x;
	double az = cabs(z);
	int nmx = (int)(fmax(nstop, az) + 8 * cbrt(az)) + 16;
	double complex dn = 0;
	for (int n = nmx; n > nstop; n--) dn = n / z - 1 / (dn + n / z);
	d[nstop] = dn;
	for (int n = nstop; n > 0; n--) d[n - 1] = n / z - 1 / (d[n] + n / z);
	double psi0 = cos(x), psi1 = sin(x), chi0 = -sin(x), chi1 = cos(x);
	double qext = 0, qsca = 0;
	for (int n = 1; n <= nstop; n++) {
		double psi = (2.0 * n - 1) * psi1 / x - psi0;
		double chi = (2.0 * n - 1) * chi1 / x - chi0;
		double complex xi = psi - I * chi, xi1 = psi1 - I * chi1;
		double complex ta = d[n] / m + n / x, tb = d[n] * m + n / x;
		double complex an = (ta * psi - psi1) / (ta * xi - xi1);
		double complex bn = (tb * psi - psi1) / (tb * xi - xi1);
		qext += (2 * n + 1) * creal(an + bn);
		qsca += (2 * n + 1) * (cabs(an) * cabs(an) + cabs(bn) * cabs(bn));
		psi0 = psi1; psi1 = psi; chi0 = chi1; chi1 = chi;
	}
	*terms += nstop;
	return 2 * qext / (x * x) + 2 * qsca / (x * x);
}

int main(void) {
	d = malloc(sizeof(double complex) * 4000);
	double xs[400];
	for (int i = 0; i < 400; i++) xs[i] = 0.1 * pow(2000 / 0.1, i / 399.0);
	long terms = 0;
	double sink = 0;
	int reps = 200;
	struct timespec t0, t1;
	clock_gettime(CLOCK_MONOTONIC, &t0);
	for (int r = 0; r < reps; r++)
		for (int i = 0; i < 400; i++) sink += sweep_one(xs[i], 1.2 + 0.001 * I, &terms);
	clock_gettime(CLOCK_MONOTONIC, &t1);
	double ns = (t1.tv_sec - t0.tv_sec) * 1e9 + (t1.tv_nsec - t0.tv_nsec);
	printf("%.2f ns/term (%ld terms per sweep; checksum %.6f)\n", ns / terms, terms / reps, sink / reps);
	return 0;
}
