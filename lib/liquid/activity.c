/* activity.c - activity coefficients and their composition derivatives:
 * NRTL, Wilson, UNIQUAC (and the ideal liquid) for N species.
 *
 * For each model the "free" partial derivatives P_im = d ln gamma_i / d x_m
 * of the closed form are written out (the x treated as independent
 * variables in the formula); the derivatives with respect to mole numbers
 * then follow by the chain rule through x_k = n_k / n_T:
 *     H_im = n_T d ln gamma_i / d n_m = P_im - sum_k x_k P_ik,
 * which is what the thermodynamic factor needs (Gamma = I + X H, see
 * include/mcdiff.h). H is symmetric (d mu_i / d n_m = d mu_m / d n_i) and
 * satisfies Gibbs-Duhem, sum_i x_i H_im = 0, for any model derived from an
 * excess Gibbs energy; the tests check both, and H against finite
 * differences of ln gamma, over random states and parameters. Every model
 * costs O(N^3) for H (O(N^2) for ln gamma alone) and allocates nothing.
 *
 * References (equations as usually written; from the papers' forms):
 *   Renon and Prausnitz, AIChE J. 14, 135 (1968), eq. 13 (multicomponent
 *     NRTL); Wilson, J. Am. Chem. Soc. 86, 127 (1964); Abrams and
 *     Prausnitz, AIChE J. 21, 116 (1975) (UNIQUAC, z = 10).
 */
#include <math.h>
#include <string.h>

#include "base/mcd_internal.h"
#include "liquid/liquid.h"

/* UNIQUAC lattice coordination number (Abrams and Prausnitz 1975). */
#define UNIQUAC_Z 10.0

/* NRTL. With G_ij = exp(-alpha_ij tau_ij), S_j = sum_k x_k G_kj,
 * eps_j = sum_k x_k tau_kj G_kj / S_j and W_ij = G_ij (tau_ij - eps_j) / S_j:
 *   ln gamma_i = eps_i + sum_j x_j W_ij,
 *   d eps_i / d x_m = W_mi,  d W_ij / d x_m = -(G_ij W_mj + W_ij G_mj) / S_j,
 *   P_im = W_mi + W_im - sum_j x_j (G_ij W_mj + W_ij G_mj) / S_j. */
static void nrtl(size_t n, const double *tau, const double *x, double *lng,
                 double *P, const mcdi_act_scratch *sc)
{
    double *S = sc->s1, *eps = sc->s2, *xs = sc->s3, *G = sc->g, *W = sc->w;
    size_t i, j, k, m;
    for (j = 0; j < n; j++) {
        double s = 0.0, c = 0.0;
        for (k = 0; k < n; k++) {
            s += x[k] * G[k * n + j];
            c += x[k] * tau[k * n + j] * G[k * n + j];
        }
        S[j] = s;
        eps[j] = c / s;
        xs[j] = x[j] / s;
    }
    for (i = 0; i < n; i++)
        for (j = 0; j < n; j++)
            W[i * n + j] = G[i * n + j] * (tau[i * n + j] - eps[j]) / S[j];
    for (i = 0; i < n; i++) {
        double s = eps[i];
        for (j = 0; j < n; j++)
            s += x[j] * W[i * n + j];
        lng[i] = s;
    }
    for (i = 0; i < n; i++) {
        for (m = 0; m < n; m++) {
            double s = W[m * n + i] + W[i * n + m];
            for (j = 0; j < n; j++)
                s -= xs[j] * (G[i * n + j] * W[m * n + j] +
                              W[i * n + j] * G[m * n + j]);
            P[i * n + m] = s;
        }
    }
}

/* Wilson's form in composition variables z (x for Wilson, the area
 * fractions theta for the UNIQUAC residual part), with L the model matrix
 * and S_k = sum_j z_j L_kj:
 *   f_i = 1 - ln S_i - sum_k z_k L_ki / S_k,
 *   P_im = -L_im / S_i - L_mi / S_m + sum_k z_k L_ki L_km / S_k^2. */
static void wilson_form(size_t n, const double *L, const double *z, double *f,
                        double *P, double *S)
{
    size_t i, k, m;
    for (k = 0; k < n; k++) {
        double s = 0.0;
        for (m = 0; m < n; m++)
            s += z[m] * L[k * n + m];
        S[k] = s;
    }
    for (i = 0; i < n; i++) {
        double s = 1.0 - log(S[i]);
        for (k = 0; k < n; k++)
            s -= z[k] * L[k * n + i] / S[k];
        f[i] = s;
    }
    for (i = 0; i < n; i++) {
        for (m = 0; m < n; m++) {
            double s = -L[i * n + m] / S[i] - L[m * n + i] / S[m];
            for (k = 0; k < n; k++)
                s += z[k] * L[k * n + i] * L[k * n + m] / (S[k] * S[k]);
            P[i * n + m] = s;
        }
    }
}

/* UNIQUAC combinatorial part. With R = sum x r, Q = sum x q, l_i =
 * (z/2)(r_i - q_i) - (r_i - 1), Lx = sum x_j l_j (phi_i / x_i = r_i / R,
 * theta_i / phi_i = q_i R / (r_i Q)):
 *   ln gamma_i = ln(r_i/R) + (z/2) q_i ln(q_i R / (r_i Q)) + l_i
 *                - (r_i / R) Lx,
 *   P_im = -r_m/R + (z/2) q_i (r_m/R - q_m/Q) - r_i l_m / R
 *          + r_i r_m Lx / R^2. */
static void uniquac_comb(size_t n, const double *r, const double *q,
                         const double *x, double *lng, double *P)
{
    const double h = 0.5 * UNIQUAC_Z;
    double R = 0.0, Q = 0.0, Lx = 0.0;
    size_t i, m;
    for (i = 0; i < n; i++) {
        R += x[i] * r[i];
        Q += x[i] * q[i];
        Lx += x[i] * (h * (r[i] - q[i]) - (r[i] - 1.0));
    }
    for (i = 0; i < n; i++) {
        double li = h * (r[i] - q[i]) - (r[i] - 1.0);
        lng[i] = log(r[i] / R) + h * q[i] * log(q[i] * R / (r[i] * Q)) + li -
                 r[i] / R * Lx;
        for (m = 0; m < n; m++) {
            double lm = h * (r[m] - q[m]) - (r[m] - 1.0);
            P[i * n + m] = -r[m] / R + h * q[i] * (r[m] / R - q[m] / Q) -
                           r[i] * lm / R + r[i] * r[m] * Lx / (R * R);
        }
    }
}

/* UNIQUAC: combinatorial part plus the residual part
 *   ln gamma_i^R = q_i [1 - ln sum_j theta_j tau_ji
 *                       - sum_j theta_j tau_ij / sum_k theta_k tau_kj],
 * which is q_i times Wilson's form in theta with L_ij = tau_ji; theta_k =
 * x_k q_k / Q gives d theta_k / d x_m = (q_m / Q)(delta_km - theta_k), so
 *   P^R_im = q_i (q_m / Q) (PW_im - sum_k theta_k PW_ik). */
static void uniquac(size_t n, const double *tau, const double *r,
                    const double *q, const double *x, double *lng, double *P,
                    const mcdi_act_scratch *sc)
{
    double *theta = sc->s2, *f = sc->s3, *L = sc->g, *PW = sc->w, Q = 0.0;
    size_t i, j, m;
    uniquac_comb(n, r, q, x, lng, P);
    for (i = 0; i < n; i++)
        Q += x[i] * q[i];
    for (i = 0; i < n; i++)
        theta[i] = x[i] * q[i] / Q;
    for (i = 0; i < n; i++)
        for (j = 0; j < n; j++)
            L[i * n + j] = tau[j * n + i];
    wilson_form(n, L, theta, f, PW, sc->s1);
    for (i = 0; i < n; i++) {
        double tp = 0.0;
        lng[i] += q[i] * f[i];
        for (j = 0; j < n; j++)
            tp += theta[j] * PW[i * n + j];
        for (m = 0; m < n; m++)
            P[i * n + m] += q[i] * (q[m] / Q) * (PW[i * n + m] - tp);
    }
}

int mcdi_activity_eval(const mcd_liquid *liq, const double *t, const double *x,
                       double *lng, double *H, const mcdi_act_scratch *sc)
{
    size_t n = liq->n, i, j;
    double *P = sc->p, *r = sc->r, *q = sc->q;
    switch (liq->model) {
    case MCD_ACTIVITY_NRTL:
        for (i = 0; i < n * n; i++)
            sc->g[i] = exp(-liq->alpha[i] * t[i]);
        nrtl(n, t, x, lng, P, sc);
        break;
    case MCD_ACTIVITY_WILSON: wilson_form(n, t, x, lng, P, sc->s1); break;
    case MCD_ACTIVITY_UNIQUAC:
        for (i = 0; i < n; i++) {
            r[i] = liq->sp[i * MCDI_LIQ_NSP + MCD_LIQ_UNIQUAC_R];
            q[i] = liq->sp[i * MCDI_LIQ_NSP + MCD_LIQ_UNIQUAC_Q];
        }
        uniquac(n, t, r, q, x, lng, P, sc);
        break;
    case MCD_ACTIVITY_IDEAL:
    default:
        for (i = 0; i < n; i++)
            lng[i] = 0.0;
        for (i = 0; i < n * n; i++)
            P[i] = 0.0;
        break;
    }
    /* H_im = P_im - sum_k x_k P_ik */
    for (i = 0; i < n; i++) {
        double s = 0.0;
        for (j = 0; j < n; j++)
            s += x[j] * P[i * n + j];
        for (j = 0; j < n; j++)
            H[i * n + j] = P[i * n + j] - s;
    }
    for (i = 0; i < n; i++)
        if (!mcdi_finite(lng[i]))
            return -1;
    for (i = 0; i < n * n; i++)
        if (!mcdi_finite(H[i]))
            return -1;
    return 0;
}
