package org.loopledger.ident.fit;

/**
 * Frequency response of K·∏(s - z<sub>i</sub>)/∏(s - p<sub>j</sub>)·e<sup>-sτ</sup> with distinct poles, either
 * continuous at s = jω, or as its zero-order-hold sampled-data equivalent at z = e<sup>jωT</sup> (what a drive
 * sees between a held current and a sampled measurement). The sampled form is summed pole by pole,
 * G<sub>d</sub>(z) = Σ r<sub>j</sub>·(e<sup>p<sub>j</sub>T</sup> - 1)/p<sub>j</sub> / (z - e<sup>p<sub>j</sub>T</sup>), and
 * r<sub>j</sub>T/(z - 1) for p<sub>j</sub> = 0 (residues r<sub>j</sub>; Franklin, Powell and Workman, Digital
 * Control of Dynamic Systems, 3rd ed., ZOH equivalent (1 - z<sup>-1</sup>)·Z{G(s)/s}, derivation by hand),
 * with expm1 so that poles near z = 1 keep their accuracy (no high-order polynomial in z).
 *
 * <p>Complex numbers as split re/im doubles (no Complex objects).
 */
final class PoleResidueResponse {
    private PoleResidueResponse() {}

    /**
     * Writes G at every ω into re/im (modified). zeros/poles as parallel re/im arrays (not modified).
     * sampleTimeS = 0 selects the continuous response.
     */
    static void evaluate(double gain, double[] zr, double[] zi, double[] pr, double[] pi, double delayS, double sampleTimeS,
                         double[] omega, double[] re, double[] im) {
        int np = pr.length;
        if (sampleTimeS <= 0) {
            for (int k = 0; k < omega.length; k++) {
                double w = omega[k], gr = gain, gi = 0;
                for (int i = 0; i < zr.length; i++) { double ar = -zr[i], ai = w - zi[i]; double t = gr * ar - gi * ai; gi = gr * ai + gi * ar; gr = t; }
                for (int j = 0; j < np; j++) {
                    double ar = -pr[j], ai = w - pi[j], d = ar * ar + ai * ai;
                    double t = (gr * ar + gi * ai) / d; gi = (gi * ar - gr * ai) / d; gr = t;
                }
                rotate(gr, gi, -w * delayS, re, im, k);
            }
            return;
        }
        double t = sampleTimeS;
        // residues r_j = K ∏(p_j - z_i) / ∏_{l≠j}(p_j - p_l), and c_j = r_j (e^{p_j T} - 1)/p_j (r_j T at p_j = 0)
        double[] cr = new double[np], ci = new double[np], er = new double[np], ei = new double[np];
        for (int j = 0; j < np; j++) {
            double rr = gain, ri = 0;
            for (int i = 0; i < zr.length; i++) { double ar = pr[j] - zr[i], ai = pi[j] - zi[i]; double x = rr * ar - ri * ai; ri = rr * ai + ri * ar; rr = x; }
            for (int l = 0; l < np; l++) {
                if (l == j) continue;
                double ar = pr[j] - pr[l], ai = pi[j] - pi[l], d = ar * ar + ai * ai;
                if (d == 0) throw new IllegalArgumentException("repeated pole at " + pr[j] + " + j" + pi[j] + " rad/s; the sampled-data form needs distinct poles");
                double x = (rr * ar + ri * ai) / d; ri = (ri * ar - rr * ai) / d; rr = x;
            }
            double mr, mi; // (e^{pT} - 1)/p
            if (pr[j] == 0 && pi[j] == 0) { mr = t; mi = 0; }
            else {
                double[] e1 = expm1(pr[j] * t, pi[j] * t);
                double d = pr[j] * pr[j] + pi[j] * pi[j];
                mr = (e1[0] * pr[j] + e1[1] * pi[j]) / d;
                mi = (e1[1] * pr[j] - e1[0] * pi[j]) / d;
            }
            cr[j] = rr * mr - ri * mi;
            ci[j] = rr * mi + ri * mr;
            double ea = Math.exp(pr[j] * t);
            er[j] = ea * Math.cos(pi[j] * t);
            ei[j] = ea * Math.sin(pi[j] * t);
        }
        for (int k = 0; k < omega.length; k++) {
            double w = omega[k], gr = 0, gi = 0;
            for (int j = 0; j < np; j++) {
                // z - e^{pT} = e^{pT}·expm1((jω - p)T)
                double[] e1 = expm1(-pr[j] * t, (w - pi[j]) * t);
                double dr = er[j] * e1[0] - ei[j] * e1[1], di = er[j] * e1[1] + ei[j] * e1[0];
                double d = dr * dr + di * di;
                gr += (cr[j] * dr + ci[j] * di) / d;
                gi += (ci[j] * dr - cr[j] * di) / d;
            }
            rotate(gr, gi, -w * delayS, re, im, k);
        }
    }

    private static void rotate(double gr, double gi, double angle, double[] re, double[] im, int k) {
        if (angle == 0) { re[k] = gr; im[k] = gi; return; }
        double c = Math.cos(angle), s = Math.sin(angle);
        re[k] = gr * c - gi * s;
        im[k] = gr * s + gi * c;
    }

    /** e^{a + jb} - 1 without cancellation for small arguments. */
    static double[] expm1(double a, double b) {
        double s = Math.sin(b / 2);
        return new double[] {Math.expm1(a) * Math.cos(b) - 2 * s * s, Math.exp(a) * Math.sin(b)};
    }
}
