package org.loopledger.plot;

import org.junit.jupiter.api.Test;
import org.knowm.xchart.XYSeries;
import org.loopledger.frf.FrequencyGrid;
import org.loopledger.lti.TransferFunction;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** {@link BodePlot#add(String, TransferFunction)}: a model plotted on a grid chosen from its poles and zeros. */
class BodePlotModelGridTest {

    private static XYSeries series(Figure fig, int panel, String label) { return fig.panels().get(panel).getSeriesMap().get(label); }

    /** Index of the plotted x nearest to {@code x} (relative), or -1 when none lies within {@code rel}. */
    private static int find(double[] xs, double x, double rel) {
        for (int i = 0; i < xs.length; i++) if (Math.abs(xs[i] - x) <= rel * x) return i;
        return -1;
    }

    @Test
    void continuousLightlyDampedPairIsPlottedAtItsNaturalFrequencyOverTwoDecades() {
        double fn = 80, zeta = 0.01, wn = 2 * Math.PI * fn;
        TransferFunction g = TransferFunction.continuous(new double[] {wn * wn}, new double[] {1, 2 * zeta * wn, wn * wn});
        Figure fig = BodePlot.create().add("resonance", g).figure();
        XYSeries mag = series(fig, 0, "resonance"), ph = series(fig, 1, "resonance");
        double[] x = mag.getXData();
        int at = find(x, fn, 1e-9);
        assertTrue(at >= 0, "the natural frequency " + fn + " Hz is on the plotted curve");
        // textbook: the standard second-order section has |G(jωn)| = 1/(2ζ) (= 33.98 dB for ζ = 0.01) and phase -90 deg there
        assertEquals(20 * Math.log10(1 / (2 * zeta)), mag.getYData()[at], 1e-6);
        // the phase curve is nearly vertical there and decimated in screen space (kept within 0.25 px; one px in x is
        // 4 decades / 640 px, 1.45 %): read back where it crosses -90 deg and allow 0.5 % in frequency
        double[] px = ph.getXData(), py = ph.getYData();
        int k = 1;
        while (py[k] > -90) k++;
        double t = (-90 - py[k - 1]) / (py[k] - py[k - 1]);
        double crossHz = Math.exp(Math.log(px[k - 1]) + t * (Math.log(px[k]) - Math.log(px[k - 1])));
        assertEquals(fn, crossHz, 0.005 * fn);
        // two decades either side of the only natural frequency (first and last points survive decimation)
        assertEquals(fn / 100, x[0], 1e-9 * fn);
        assertEquals(fn * 100, x[x.length - 1], 1e-6 * fn);
    }

    @Test
    void undampedPairIsPlottedAroundButNotAtItsNaturalFrequency() {
        // a pole pair on the imaginary axis: G is infinite at ωn, so the grid must skip that one point
        double wn = 2 * Math.PI * 10;
        TransferFunction g = TransferFunction.continuous(new double[] {wn * wn}, new double[] {1, 0, wn * wn});
        Figure fig = BodePlot.of("undamped", g);
        double[] x = series(fig, 0, "undamped").getXData();
        assertEquals(-1, find(x, 10, 1e-7));
        assertTrue(find(x, 10, 1e-3) >= 0, "points close to the natural frequency are plotted");
    }

    @Test
    void sampledModelStopsJustBelowNyquistAndShowsItsResonance() {
        double ts = 1e-3, nyquistHz = 0.5 / ts;
        // a Tustin-style averaging filter (z + 1)/(2z): exactly zero at Nyquist, so the grid must stop short of it
        TransferFunction avg = TransferFunction.discrete(new double[] {1, 1}, new double[] {2, 0}, ts);
        double[] x = series(BodePlot.of("avg", avg), 0, "avg").getXData();
        assertTrue(x[x.length - 1] < nyquistHz, "last plotted point " + x[x.length - 1] + " Hz is below Nyquist");
        assertEquals(FrequencyGrid.BELOW_NYQUIST * nyquistHz, x[x.length - 1], 1e-9 * nyquistHz);

        // a sampled pole pair with the poles of ωn = 2π·120 rad/s, ζ = 0.02 mapped by z = e^{sT} (textbook pole mapping)
        double fn = 120, zeta = 0.02, wn = 2 * Math.PI * fn;
        double r = Math.exp(-zeta * wn * ts), th = wn * ts * Math.sqrt(1 - zeta * zeta);
        double a1 = -2 * r * Math.cos(th), a2 = r * r;
        TransferFunction res = TransferFunction.discrete(new double[] {1 + a1 + a2}, new double[] {1, a1, a2}, ts);
        double[] xr = series(BodePlot.of("res", res), 0, "res").getXData();
        assertTrue(find(xr, fn, 1e-9) >= 0, "the natural frequency " + fn + " Hz is on the plotted curve");
        assertTrue(xr[xr.length - 1] < nyquistHz);
    }

    @Test
    void nullModelIsRefused() {
        assertThrows(NullPointerException.class, () -> BodePlot.create().add("none", (TransferFunction) null));
    }

    /**
     * A two-mass plant (antiresonance 250 Hz, resonance 400 Hz, both ζ = 0.03) with a 250 µs delay, as a fit with
     * {@code withDelay()} returns it. The delay's lag is ωτ exactly (e^{-jωτ}, common practice), so above the resonance
     * the phase can only fall; the grid must stop where the delay lags two turns (4π/τ = 8 kHz here) rather than at
     * a hundred times 1/τ (64 kHz), and a model curve never carries the coherence note.
     */
    @Test
    void delayedModelStopsWhereTheDelayLagsTwoTurnsAndItsPhaseFallsSmoothly() {
        double wa = 2 * Math.PI * 250, wr = 2 * Math.PI * 400, tau = 250e-6;
        TransferFunction g = TransferFunction.continuous(new double[] {1 / (wa * wa), 2 * 0.03 / wa, 1},
                new double[] {2e-4 / (wr * wr), 2e-4 * 2 * 0.03 / wr + 1e-3 / (wr * wr), 2e-4 + 1e-3 * 2 * 0.03 / wr, 1e-3}).withDelay(tau);
        Figure fig = BodePlot.of("two-mass with delay", g);
        double[] x = series(fig, 1, "two-mass with delay").getXData(), p = series(fig, 1, "two-mass with delay").getYData();
        assertEquals(2 / tau, x[x.length - 1], 1e-6 * 2 / tau, "top at 4π/τ rad/s = 2/τ Hz");
        assertTrue(fig.note().isEmpty(), "no coherence note under a model: " + fig.note());
        // above the resonance every step of the plotted phase goes down (a saw-tooth would jump up by ~360 deg)
        double maxRise = Double.NEGATIVE_INFINITY;
        for (int i = 1; i < x.length; i++) if (x[i - 1] > 600) maxRise = Math.max(maxRise, p[i] - p[i - 1]);
        assertTrue(maxRise <= 1e-9, "largest rise above 600 Hz: " + maxRise + " deg");
        // and the total fall from 600 Hz to the top is the delay's 360·f·τ plus the rational part's, which is small
        // there: between 0 and the -90 deg the inertia leaves once the resonance pair's lag is spent (by construction)
        int k = 0;
        while (x[k] < 600) k++;
        double delayFall = 360 * (x[x.length - 1] - x[k]) * tau;
        double fall = p[k] - p[p.length - 1];
        assertTrue(fall > delayFall && fall < delayFall + 90, "fall " + fall + " deg, delay alone " + delayFall + " deg");
    }

    @Test
    void delayAboveEveryRootKeepsADecadeAboveTheHighestRoot() {
        // resonance at 20 kHz, delay 100 µs (4π/τ = 20 kHz): the grid keeps a decade above the root, not 4π/τ
        double wn = 2 * Math.PI * 20_000;
        TransferFunction g = TransferFunction.continuous(new double[] {wn * wn}, new double[] {1, 2 * 0.05 * wn, wn * wn}).withDelay(100e-6);
        double[] w = FrequencyGrid.forModelRadPerS(g);
        assertEquals(10 * wn, w[w.length - 1], 1e-9 * wn);
    }

    @Test
    void aModelFrfOnAWideGridIsUnwrappedPointToPointWithoutTheCoherenceNote() {
        // a pure 250 µs delay on the old automatic band (to 100/τ): e^{-jωτ} lags 360·f·τ deg exactly, so the plotted
        // phase must fall monotonically; the trend rule for noisy data read the fast roll as noise (saw-tooth + note)
        double tau = 250e-6;
        TransferFunction d = TransferFunction.gain(1).withDelay(tau);
        org.loopledger.frf.Frf model = org.loopledger.frf.Frf.ofModel(d, FrequencyGrid.logRadPerS(0.01 / tau, 100 / tau, 401));
        Figure fig = BodePlot.create().add("delay", model).figure();
        double[] x = series(fig, 1, "delay").getXData(), p = series(fig, 1, "delay").getYData();
        assertTrue(fig.note().isEmpty(), "no coherence note under a model: " + fig.note());
        for (int i = 1; i < x.length; i++) assertTrue(p[i] < p[i - 1], "phase rises at " + x[i] + " Hz");
        assertEquals(-360 * x[x.length - 1] * tau, p[p.length - 1] - p[0] - 360 * x[0] * tau, 1e-6 * 360 * x[x.length - 1] * tau);
    }
}
