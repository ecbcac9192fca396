package org.loopledger.ident.spectral;

import org.loopledger.frf.Frf;
import org.loopledger.lti.Units;

import java.util.Locale;

/**
 * Plant, sensitivity and process sensitivity from a closed-loop record with an excitation r injected
 * at the plant input, u = r - C·y (u: plant input, e.g. measured current; y: plant output, e.g. velocity):
 * <pre>
 *   u = S·r - S·C·v,   y = P·S·r + S·v,   S = 1/(1 + P·C)
 *   Ŝ  = S_{ru}/S_{rr},   P̂S = S_{ry}/S_{rr},   P̂ = S_{ry}/S_{ru}
 * </pre>
 * Cross-spectra with r, which is uncorrelated with the loop's noise v, remove v from both numerator and
 * denominator (the indirect / instrumental-variable estimate; Ljung, System Identification, 2nd ed.,
 * 1999, section 13.5, from memory). The naive u → y H1, S<sub>uy</sub>/S<sub>uu</sub>, is kept for
 * comparison: under feedback it tends to -1/C wherever v dominates, since the loop makes u depend on v.
 *
 * <p><b>The position reference as the external signal.</b> Many records hold no injected current, only a
 * cascade following a position reference r<sub>x</sub> (a back-and-forth move, a periodic test profile). The
 * plant estimate needs nothing but an external signal that reaches u and is uncorrelated with the loop's
 * noise: with y = P·u + v and S<sub>rv</sub> = 0, S<sub>ry</sub> = P·S<sub>ru</sub> for an r entering anywhere in the
 * loop (derivation by hand), so call {@link #welch} with the position reference as {@code r}, the current
 * as {@code u} and the measured velocity as {@code y}: {@link #plant()} is then the current-to-velocity plant
 * again, while {@link #sensitivity()} and {@link #processSensitivity()} become the closed-loop responses from
 * the position reference to current and to velocity (not S and PS). The estimate holds only where the
 * reference has energy: a smooth move profile excites little above its first few harmonics, so check the
 * coherence, and prefer a periodic reference with {@link PeriodicAverage} (period by {@link PeriodDetection}).
 *
 * <p>Uncertainty of P̂ by first-order perturbation (derivation by hand): P̂ - P ≈ S<sub>re</sub>/S<sub>ru</sub>
 * with e = y - P·u = v, so σ<sub>P</sub>² = S<sub>rr</sub>·S<sub>ee</sub>/(n<sub>eff</sub>·|S<sub>ru</sub>|²),
 * S<sub>ee</sub> = S<sub>yy</sub> - 2·Re(P̂·conj(S<sub>uy</sub>)) + |P̂|²·S<sub>uu</sub>. The coherence given
 * with P̂ is the smaller of γ²<sub>ru</sub> and γ²<sub>ry</sub>.
 */
public record ClosedLoopEstimate(Frf plant, Frf sensitivity, Frf processSensitivity, Frf naive, CrossSpectra spectra) {

    /** From r (excitation), u (plant input) and y (plant output), sampled together. */
    public static ClosedLoopEstimate welch(double[] r, double[] u, double[] y, double sampleRateHz, WelchOptions options) {
        CrossSpectra s = CrossSpectra.welch(sampleRateHz, options, r, u, y);
        int bins = s.bins() - 1;
        double[] fAll = s.frequencyHz();
        double[] f = new double[bins];
        double[] pr = new double[bins], pi = new double[bins], sr = new double[bins], si = new double[bins];
        double[] psr = new double[bins], psi = new double[bins], nr = new double[bins], ni = new double[bins];
        double[] cohP = new double[bins], sigP = new double[bins], cohS = new double[bins], sigS = new double[bins];
        double[] cohPS = new double[bins], sigPS = new double[bins], cohN = new double[bins], sigN = new double[bins];
        double n = s.effectiveAverages();
        for (int k = 0; k < bins; k++) {
            int b = k + 1;
            f[k] = fAll[b];
            double srr = s.autoAt(0, b), suu = s.autoAt(1, b), syy = s.autoAt(2, b);
            double rur = s.crossReAt(0, 1, b), rui = s.crossImAt(0, 1, b);
            double ryr = s.crossReAt(0, 2, b), ryi = s.crossImAt(0, 2, b);
            double uyr = s.crossReAt(1, 2, b), uyi = s.crossImAt(1, 2, b);
            double ru2 = rur * rur + rui * rui;
            if (!(srr > 0) || !(ru2 > 0) || !(suu > 0)) {
                throw new IllegalArgumentException("the excitation has no energy at " + Units.formatHz(f[k])
                        + " (or the plant input is uncorrelated with it); excite that frequency or restrict the band");
            }
            // P = Sry / Sru
            pr[k] = (ryr * rur + ryi * rui) / ru2;
            pi[k] = (ryi * rur - ryr * rui) / ru2;
            sr[k] = rur / srr;
            si[k] = rui / srr;
            psr[k] = ryr / srr;
            psi[k] = ryi / srr;
            nr[k] = uyr / suu;
            ni[k] = uyi / suu;
            double gru = ru2 / (srr * suu), gry = syy > 0 ? (ryr * ryr + ryi * ryi) / (srr * syy) : 0, guy = syy > 0 ? (uyr * uyr + uyi * uyi) / (suu * syy) : 0;
            gru = Math.min(1, gru);
            gry = Math.min(1, gry);
            guy = Math.min(1, guy);
            // S_ee with e = y - P u: Syy - 2 Re(P conj(Suy)) + |P|^2 Suu
            double see = syy - 2 * (pr[k] * uyr + pi[k] * uyi) + (pr[k] * pr[k] + pi[k] * pi[k]) * suu;
            sigP[k] = Math.sqrt(Math.max(0, see) * srr / (n * ru2));
            cohP[k] = Math.min(gru, gry);
            cohS[k] = gru;
            sigS[k] = Math.sqrt((1 - gru) * suu / (n * srr));
            cohPS[k] = gry;
            sigPS[k] = Math.sqrt((1 - gry) * syy / (n * srr));
            cohN[k] = guy;
            sigN[k] = Math.sqrt((1 - guy) * syy / (n * suu));
        }
        return new ClosedLoopEstimate(
                Frf.ofPartsHz(f, pr, pi).withCoherence(cohP).withUncertainty(sigP),
                Frf.ofPartsHz(f, sr, si).withCoherence(cohS).withUncertainty(sigS),
                Frf.ofPartsHz(f, psr, psi).withCoherence(cohPS).withUncertainty(sigPS),
                Frf.ofPartsHz(f, nr, ni).withCoherence(cohN).withUncertainty(sigN), s);
    }

    @Override public String toString() {
        return String.format(Locale.ROOT, "ClosedLoopEstimate[plant, S, PS and naive u->y on %d bins %s .. %s, %d segments]",
                plant.size(), Units.formatHz(plant.frequencyHz()[0]), Units.formatHz(plant.frequencyHz()[plant.size() - 1]), spectra.segments());
    }
}
