/* gen_collision.c - compute the reduced collision integrals Omega(l,s)*
 * of the Lennard-Jones (12-6) potential by direct quadrature of their
 * kinetic-theory definitions and write lib/props/collision_table.c.
 *
 * Not part of the build: run it by hand when the table must change,
 *     cc -O2 -o /tmp/gen_collision tools/gen_collision.c -lm
 *     /tmp/gen_collision > lib/props/collision_table.c
 * and commit the output. It also prints checks on stderr: the pure
 * r^-12 potential, whose ratios C* and B* are known exactly, and the
 * Lennard-Jones Omega(1,1)* and Omega(2,2)* against the Monchick-Mason
 * values as tabulated by Bird, Stewart and Lightfoot (2002), Table E.2.
 *
 * Definitions (Hirschfelder, Curtiss and Bird 1954, eqs. 8.2-1 to 8.2-5;
 * reduced units sigma = eps = 1, V*(r) = 4 (r^-12 - r^-6)):
 *   chi(b, E)  = pi - 2 b int_{r0}^inf dr / (r^2 sqrt(1 - b^2/r^2 -
 *                V*(r)/E)),  r0 the largest root of the radicand;
 *   Q(l)*(E)   = 2 / (1 - (1 + (-1)^l) / (2 (1 + l)))
 *                  int_0^inf (1 - cos^l chi) b db;
 *   Omega(l,s)*(T*) = 1 / ((s+1)! T*^(s+2))
 *                  int_0^inf exp(-E/T*) E^(s+1) Q(l)*(E) dE.
 * Each is 1 for rigid spheres of diameter sigma.
 *
 * Quadratures:
 *  - chi: u = r0 / r and u = 1 - t^2, which removes the inverse square
 *    root at the turning point; the radicand is written as
 *    beta^2 (1 - u^2) + (V(r0) - V(r0/u)) / E (beta = b / r0), which is
 *    zero at u = 1 without cancellation against 1; Gauss-Legendre
 *    panels graded towards t = 0 (near orbiting the integrand grows like
 *    1/t there).
 *  - r0: scan inwards from a radius where the radicand is positive in
 *    steps of 0.2 %, then bisection: the largest root, also when
 *    orbiting gives three.
 *  - b: adaptive Simpson (tolerance 1e-8 b_max^2 shared by the panels,
 *    Q being of order b_max^2; relaxed as E^-3 below E = 0.05, where the
 *    thermal weight is negligible) on 64 panels of
 *    [0, b_max], b_max = 7 E^(-1/6) (chi < 1e-4 there from the r^-6
 *    tail); the logarithmic singularity of chi at the orbiting impact
 *    parameter is bounded in the integrand and is cut by a depth limit.
 *  - E: trapezoid rule in y = ln E on [ln 1e-6, ln 2e4] (smooth and
 *    decaying at both ends); run with two steps to see its error.
 */
#include <math.h>
#include <stdio.h>
#include <stdlib.h>

#define PI 3.14159265358979323846
#define NGL 16

static int g_repulsive; /* 1: V = 4 r^-12 only */
static double g_glx[NGL], g_glw[NGL];
static long g_bad;

static double pot(double r)
{
    double r2 = 1.0 / (r * r), r6 = r2 * r2 * r2;
    return g_repulsive ? 4.0 * r6 * r6 : 4.0 * (r6 * r6 - r6);
}

static double radicand(double r, double b, double E)
{
    return 1.0 - b * b / (r * r) - pot(r) / E;
}

static void gauss_legendre(void)
{
    int i, k;
    for (i = 0; i < NGL; i++) {
        double x = cos(PI * (i + 0.75) / (NGL + 0.5)), p0, p1, dp;
        for (k = 0; k < 100; k++) {
            int j;
            double dx;
            p0 = 1.0;
            p1 = x;
            for (j = 2; j <= NGL; j++) {
                double p2 = ((2.0 * j - 1.0) * x * p1 - (j - 1.0) * p0) / j;
                p0 = p1;
                p1 = p2;
            }
            dp = NGL * (x * p1 - p0) / (x * x - 1.0);
            dx = p1 / dp;
            x -= dx;
            if (fabs(dx) < 1e-16)
                break;
        }
        g_glx[i] = x;
        g_glw[i] = 2.0 / ((1.0 - x * x) * dp * dp);
    }
}

static double turning_point(double b, double E)
{
    double hi = b > 1.0 ? b : 1.0, lo;
    int k;
    while (!(radicand(hi, b, E) > 0.0))
        hi *= 1.1;
    for (;;) {
        lo = hi * 0.998;
        if (!(radicand(lo, b, E) > 0.0))
            break;
        hi = lo;
    }
    for (k = 0; k < 80; k++) {
        double mid = 0.5 * (lo + hi);
        if (radicand(mid, b, E) > 0.0)
            hi = mid;
        else
            lo = mid;
    }
    return hi;
}

static double deflection(double b, double E)
{
    static const double edges[] = {0.0,  1e-5, 1e-4, 1e-3, 1e-2,
                                   0.05, 0.2,  0.5,  1.0};
    const int n_panels = (int)(sizeof edges / sizeof edges[0]) - 1;
    double r0, beta, V0, sum = 0.0;
    int p, i;
    if (b == 0.0)
        return PI;
    r0 = turning_point(b, E);
    beta = b / r0;
    V0 = pot(r0);
    for (p = 0; p < n_panels; p++) {
        double a = edges[p], c = edges[p + 1];
        for (i = 0; i < NGL; i++) {
            double t = 0.5 * (a + c) + 0.5 * (c - a) * g_glx[i];
            double u = 1.0 - t * t;
            double H = beta * beta * (1.0 - u * u) + (V0 - pot(r0 / u)) / E;
            if (!(H > 0.0)) {
                g_bad++;
                continue;
            }
            sum += 0.5 * (c - a) * g_glw[i] * 2.0 * t / sqrt(H);
        }
    }
    return PI - 2.0 * beta * sum;
}

/* integrand pair: (1 - cos chi) b and (1 - cos^2 chi) b */
static void qfun(double b, double E, double f[2])
{
    double c = cos(deflection(b, E));
    f[0] = (1.0 - c) * b;
    f[1] = (1.0 - c * c) * b;
}

static void simpson(double a, double c, const double fa[2],
                    const double fm[2], const double fc[2], double E,
                    double tol, int depth, double out[2])
{
    double m = 0.5 * (a + c), l[2], r[2], s_whole[2], s_l[2], s_r[2];
    int k, ok = 1;
    qfun(0.5 * (a + m), E, l);
    qfun(0.5 * (m + c), E, r);
    for (k = 0; k < 2; k++) {
        s_whole[k] = (c - a) / 6.0 * (fa[k] + 4.0 * fm[k] + fc[k]);
        s_l[k] = (m - a) / 6.0 * (fa[k] + 4.0 * l[k] + fm[k]);
        s_r[k] = (c - m) / 6.0 * (fm[k] + 4.0 * r[k] + fc[k]);
        if (fabs(s_l[k] + s_r[k] - s_whole[k]) > 15.0 * tol)
            ok = 0;
    }
    if (ok || depth >= 20) {
        for (k = 0; k < 2; k++)
            out[k] = s_l[k] + s_r[k] + (s_l[k] + s_r[k] - s_whole[k]) / 15.0;
        return;
    }
    {
        double o1[2], o2[2];
        simpson(a, m, fa, l, fm, E, 0.5 * tol, depth + 1, o1);
        simpson(m, c, fm, r, fc, E, 0.5 * tol, depth + 1, o2);
        for (k = 0; k < 2; k++)
            out[k] = o1[k] + o2[k];
    }
}

/* Q(1)* and Q(2)* at reduced energy E */
static void cross_sections(double E, double *q1, double *q2)
{
    const int panels = 64;
    double bmax = 7.0 * pow(E, -1.0 / 6.0), acc[2] = {0.0, 0.0}, tol;
    int p, k;
    if (bmax < 3.0)
        bmax = 3.0;
    /* below E ~ 0.05 the thermal weight exp(-x) x^(s+2), x = E / T* >= E /
     * 0.3, is below 1e-5 and falls as E^3: so may the accuracy of Q, and
     * there Q's integrand oscillates fast inside the orbiting radius */
    tol = 1e-8 * bmax * bmax / panels;
    if (E < 0.05)
        tol *= pow(0.05 / E, 3.0);
    for (p = 0; p < panels; p++) {
        double a = bmax * p / panels, c = bmax * (p + 1) / panels;
        double fa[2], fm[2], fc[2], o[2];
        qfun(a, E, fa);
        qfun(0.5 * (a + c), E, fm);
        qfun(c, E, fc);
        simpson(a, c, fa, fm, fc, E, tol, 0, o);
        for (k = 0; k < 2; k++)
            acc[k] += o[k];
    }
    *q1 = 2.0 * acc[0];
    *q2 = 2.0 * acc[1] / (2.0 / 3.0);
}

#define YMIN (-13.815510557964274) /* ln 1e-6 */
#define YMAX (9.903487552536127)   /* ln 2e4 */

/* Omega(1,1), Omega(1,2), Omega(1,3), Omega(2,2) at T* from Q on a grid
 * of step h in ln E (every stride-th point of the stored grid). */
static void omegas(double Ts, int n, const double *y, const double *q1,
                   const double *q2, int stride, double out[4])
{
    static const double fact[] = {1.0, 1.0, 2.0, 6.0, 24.0};
    double s11 = 0, s12 = 0, s13 = 0, s22 = 0, h = (y[1] - y[0]) * stride;
    int k;
    for (k = 0; k < n; k += stride) {
        double x = exp(y[k]) / Ts, e = exp(-x);
        double w = (k == 0 || k == n - 1) ? 0.5 : 1.0;
        s11 += w * e * x * x * x * q1[k];
        s12 += w * e * x * x * x * x * q1[k];
        s13 += w * e * x * x * x * x * x * q1[k];
        s22 += w * e * x * x * x * x * q2[k];
    }
    out[0] = h * s11 / fact[2];
    out[1] = h * s12 / fact[3];
    out[2] = h * s13 / fact[4];
    out[3] = h * s22 / fact[3];
}

#define NT 201
#define TS_MIN 0.3
#define TS_MAX 100.0

int main(void)
{
    const int n = 1 + 2 * 476; /* step h = (YMAX - YMIN) / 952 ~ 0.025 */
    double *y = malloc(sizeof(double) * n), *q1 = malloc(sizeof(double) * n);
    double *q2 = malloc(sizeof(double) * n);
    static double tab[NT][4];
    int k, pass;
    if (!y || !q1 || !q2)
        return 1;
    gauss_legendre();
    for (pass = 0; pass < 2; pass++) {
        g_repulsive = pass == 0;
        for (k = 0; k < n; k++) {
            y[k] = YMIN + (YMAX - YMIN) * k / (n - 1);
            cross_sections(exp(y[k]), &q1[k], &q2[k]);
        }
        if (g_repulsive) {
            /* inverse power n = 12: Omega(l,s)* ~ Gamma(s + 2 - 2/n) / (s+1)!
             * T*^(-2/n) A_l, so C* = (3 - 2/n) / 3 = 17/18 and
             * the ratio Omega(1,3)* / Omega(1,1)* = (4 - 2/n)(3 - 2/n) / 12 */
            double o[4], C_exact = 17.0 / 18.0;
            double B_exact = 5.0 * C_exact - 4.0 * (23.0 / 6.0) * (17.0 / 6.0) / 12.0;
            omegas(2.0, n, y, q1, q2, 1, o);
            fprintf(stderr,
                    "r^-12 check: C* %.8f (exact %.8f)  B* %.8f (exact "
                    "%.8f)\n",
                    o[1] / o[0], C_exact, (5 * o[1] - 4 * o[2]) / o[0],
                    B_exact);
            continue;
        }
    }
    for (k = 0; k < NT; k++) {
        double Ts = TS_MIN * exp(log(TS_MAX / TS_MIN) * k / (NT - 1)), o2[4];
        omegas(Ts, n, y, q1, q2, 1, tab[k]);
        omegas(Ts, n, y, q1, q2, 2, o2);
        if (k % 20 == 0)
            fprintf(stderr,
                    "T* %8.4f  O11 %.6f O12 %.6f O13 %.6f O22 %.6f  "
                    "step-halving change %.1e\n",
                    Ts, tab[k][0], tab[k][1], tab[k][2], tab[k][3],
                    fabs(o2[0] / tab[k][0] - 1) + fabs(o2[2] / tab[k][2] - 1) +
                        fabs(o2[3] / tab[k][3] - 1));
    }
    fprintf(stderr, "skipped radicand points: %ld\n", g_bad);
    printf("/* collision_table.c - generated by tools/gen_collision.c; do not "
           "edit.\n"
           " * Reduced collision integrals of the Lennard-Jones (12-6) "
           "potential by\n"
           " * direct quadrature of their definitions (see the tool), at %d "
           "points\n"
           " * uniform in ln T* from %g to %g: Omega(1,1)*, Omega(1,2)*, "
           "Omega(1,3)*,\n"
           " * Omega(2,2)*. */\n"
           "#include \"props/collision.h\"\n\n"
           "const double mcdi_collision_table[MCDI_COLL_NT][4] = {\n",
           NT, TS_MIN, TS_MAX);
    for (k = 0; k < NT; k++)
        printf("    {%.10e, %.10e, %.10e, %.10e},\n", tab[k][0], tab[k][1],
               tab[k][2], tab[k][3]);
    printf("};\n");
    free(y);
    free(q1);
    free(q2);
    return 0;
}
