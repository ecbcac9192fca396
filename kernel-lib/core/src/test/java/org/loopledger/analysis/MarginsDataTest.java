package org.loopledger.analysis;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.loopledger.frf.Frf;
import org.loopledger.frf.FrequencyGrid;
import org.loopledger.lti.TransferFunction;

import static org.junit.jupiter.api.Assertions.*;

/**
 * The data path: the same references checked on an Frf of the model (as python-control checks a
 * system, an FRD of it, and raw arrays).
 */
class MarginsDataTest {

    /** 2,000 log-spaced points over 4 decades: Δ = ln(1e4)/1999 = 4.6e-3 in ln ω. */
    static Frf sampled(TransferFunction l) { return Frf.ofModel(l, FrequencyGrid.logRadPerS(0.01, 100, 2000)); }

    /**
     * An Frf computed from a model is described as such, measured data as measured data; the crossover accessor
     * is named for what it returns (the old {@code phaseMargin()} returned a GainCrossover). A loop built around a
     * model plant keeps the origin.
     */
    @Test
    void marginsSayWhereTheDataComeFrom() {
        TransferFunction l = MarginsModelTest.third(1);
        Frf computed = sampled(l);
        Frf measured = Frf.ofParts(computed.omegaRadPerS(), computed.real(), computed.imag());
        assertTrue(computed.isComputedFromModel());
        assertFalse(measured.isComputedFromModel());
        String c = Margins.of(computed).toString(), m = Margins.of(measured).toString();
        assertFalse(c.contains("measured data"), c);
        assertTrue(c.startsWith("Margins (model response on a grid, 2000 points"), c);
        assertTrue(m.startsWith("Margins (measured data, 2000 points"), m);
        assertTrue(computed.times(l).isComputedFromModel());
        assertFalse(measured.times(computed).isComputedFromModel(), "anything multiplied by measured data is measured");
        assertTrue(computed.restrictedToRadPerS(0.1, 10).isComputedFromModel());
        var loops = org.loopledger.control.Cascade.of(computed, org.loopledger.control.Piv.of(1, 0.1, 0.1),
                org.loopledger.control.FilterChain.none(), org.loopledger.control.DriveTiming.continuous());
        assertTrue(loops.velocityLoop().isComputedFromModel() && loops.plantInputLoop().isComputedFromModel());
        assertThrows(NoSuchMethodException.class, () -> Margins.class.getMethod("phaseMargin"));
        assertEquals(GainCrossover.class, Margins.of(l).phaseMarginCrossover().orElseThrow().getClass());
    }

    /**
     * Log-linear interpolation errs by about Δ²/8 times the curvature of log|L| and phase in ln ω (order 1
     * here): ~3e-6. Tolerance 1e-4 relative on frequencies and ratios, 1e-3 deg on phase margins.
     * References: the hand results of MarginsModelTest (phase crossover √2, GM 6/K) and the model's margins.
     */
    @ParameterizedTest
    @ValueSource(doubles = {0.5, 1, 2, 4})
    void frfOfModelAgreesWithModel(double k) {
        TransferFunction l = MarginsModelTest.third(k);
        Margins model = Margins.of(l);
        Margins data = Margins.of(sampled(l));
        assertTrue(data.measured());
        PhaseCrossover pc = data.upperGainMargin().orElseThrow();
        assertEquals(Math.sqrt(2), pc.omegaRadPerS(), 1e-4 * Math.sqrt(2));
        assertEquals(6 / k, pc.gainMarginRatio(), 1e-4 * 6 / k);
        assertEquals(model.gainCrossovers().size(), data.gainCrossovers().size());
        GainCrossover gm = model.phaseMarginCrossover().get(), gd = data.phaseMarginCrossover().get();
        assertEquals(gm.omegaRadPerS(), gd.omegaRadPerS(), 1e-4 * gm.omegaRadPerS());
        assertEquals(gm.phaseMarginDeg(), gd.phaseMarginDeg(), 1e-3);
        assertEquals(gm.delayMarginS(), gd.delayMarginS(), 1e-4 * gm.delayMarginS());
        if (!model.sensitivityPeak().atBandEdge()) { // K = 0.5: |S| rises towards 1 at the top of either band, not comparable
            assertEquals(model.sensitivityPeak().magnitude(), data.sensitivityPeak().magnitude(), 1e-4 * model.sensitivityPeak().magnitude());
            // the peak is flat: its frequency is far less sharply defined than its height
            assertEquals(model.sensitivityPeak().omegaRadPerS(), data.sensitivityPeak().omegaRadPerS(), 2e-3 * model.sensitivityPeak().omegaRadPerS());
        }
        if (!model.complementaryPeak().atBandEdge()) { // K = 0.5: |T| is largest (1) towards DC, at the bottom of either band
            assertEquals(model.complementaryPeak().magnitude(), data.complementaryPeak().magnitude(), 1e-4 * model.complementaryPeak().magnitude());
        }
        assertEquals(model.bandwidth().omegaRadPerS().getAsDouble(), data.bandwidth().omegaRadPerS().getAsDouble(),
                1e-4 * model.bandwidth().omegaRadPerS().getAsDouble());
        assertEquals(1, data.netIntegrators(), "estimated from the -20 dB/decade low-frequency slope");
    }

    /** Raw arrays (the fast path) give the very same numbers as the Frf they came from. */
    @Test
    void arraysFastPathEqualsFrfPath() {
        Frf m = sampled(MarginsModelTest.third(2));
        Frf f = Frf.ofParts(m.omegaRadPerS(), m.real(), m.imag()); // raw arrays carry no origin: compare with plain data
        Margins a = Margins.ofArrays(f.omegaRadPerS(), f.real(), f.imag());
        Margins b = Margins.of(f);
        assertEquals(b.toString(), a.toString());
        assertEquals(b.phaseMarginDeg().getAsDouble(), a.phaseMarginDeg().getAsDouble(), 0);
    }

    /** The conditionally stable loop on data: both gain margins (hand results in MarginsModelTest). */
    @Test
    void conditionallyStableOnData() {
        TransferFunction l = MarginsModelTest.conditional(20);
        Margins d = Margins.of(Frf.ofModel(l, FrequencyGrid.logRadPerS(0.5, 2000, 2000)));
        assertEquals(95 - Math.sqrt(7025), d.lowerGainMargin().orElseThrow().omegaRadPerS(), 1e-4 * 11.2);
        assertEquals(95 + Math.sqrt(7025), d.upperGainMargin().orElseThrow().omegaRadPerS(), 1e-4 * 178.8);
        assertEquals(3, d.netIntegrators(), "three integrators: -60 dB/decade at the bottom of the band");
    }

    /**
     * Band not covering the gain crossover (ω_gc = 0.446 rad/s for K = 1): no phase margin "none in band",
     * and a warning that |L| is already below 1 at the bottom. Nothing is extrapolated.
     */
    @Test
    void bandMissingGainCrossoverSaysNoneInBand() {
        Margins d = Margins.of(Frf.ofModel(MarginsModelTest.third(1), FrequencyGrid.logRadPerS(1, 100, 500)));
        assertTrue(d.gainCrossovers().isEmpty());
        assertTrue(d.phaseMarginDeg().isEmpty());
        assertTrue(d.delayMarginS().isEmpty());
        String s = d.toString();
        assertTrue(s.contains("PM none in band"), s);
        assertTrue(d.warnings().stream().anyMatch(w -> w.kind() == LoopWarning.Kind.CROSSOVER_BELOW_BAND && w.message().contains("bottom of the band")), d.warnings().toString());
        // the phase crossover at √2 is inside this band and still found
        assertEquals(Math.sqrt(2), d.upperGainMargin().orElseThrow().omegaRadPerS(), 1e-3);
    }

    /** Band stopping below the phase crossover (√2 rad/s) and with |L| &gt; 1 at its top: none in band, warned. */
    @Test
    void bandMissingPhaseCrossoverWarns() {
        Margins d = Margins.of(Frf.ofModel(MarginsModelTest.third(4), FrequencyGrid.logRadPerS(0.01, 0.8, 500)));
        assertTrue(d.phaseCrossovers().isEmpty());
        assertTrue(d.gainMarginDb().isEmpty());
        assertTrue(d.toString().contains("GM none in band"), d.toString());
        assertTrue(d.warnings().stream().anyMatch(w -> w.kind() == LoopWarning.Kind.CROSSOVER_ABOVE_BAND && w.message().contains("top of the band")), d.warnings().toString());
        assertTrue(d.warnings().stream().anyMatch(w -> w.kind() == LoopWarning.Kind.NO_PHASE_CROSSOVER_IN_BAND && w.message().contains("no phase crossover in the measured band")));
    }

    /**
     * Seeded measurement noise (2 % magnitude and 0.02 rad phase, Gaussian, seed 42; invented data for a
     * behavioural check): crossings may repeat in a cluster, all are listed, the worst counts, and a warning
     * says so. The figures stay near the noise-free ones: 2 % in |L| moves GM by about 2 % (0.2 dB) and the
     * phase noise moves PM by about 1 deg; tolerances 1 dB and 3 deg.
     */
    @Test
    void noisyDataListsClustersAndWarns() {
        TransferFunction l = MarginsModelTest.third(2);
        double[] w = FrequencyGrid.logRadPerS(0.01, 100, 2000);
        Frf f = Frf.ofModel(l, w);
        double[] re = f.real(), im = f.imag();
        java.util.Random rnd = new java.util.Random(42);
        for (int i = 0; i < w.length; i++) {
            double s = 1 + 0.02 * rnd.nextGaussian(), p = 0.02 * rnd.nextGaussian();
            double x = (re[i] * Math.cos(p) - im[i] * Math.sin(p)) * s, y = (re[i] * Math.sin(p) + im[i] * Math.cos(p)) * s;
            re[i] = x;
            im[i] = y;
        }
        Margins clean = Margins.of(l), noisy = Margins.ofArrays(w, re, im);
        assertEquals(clean.gainMarginDb().getAsDouble(), noisy.gainMarginDb().getAsDouble(), 1);
        assertEquals(clean.phaseMarginDeg().getAsDouble(), noisy.phaseMarginDeg().getAsDouble(), 3);
        assertTrue(noisy.gainMarginDb().getAsDouble() <= noisy.phaseCrossovers().stream().mapToDouble(PhaseCrossover::gainMarginDb).max().getAsDouble());
        // with this seed the noise makes the phase cross -180 deg three times near 0.22 Hz
        assertTrue(noisy.phaseCrossovers().size() > 1, noisy.toString());
        assertTrue(noisy.warnings().stream().anyMatch(x -> x.kind() == LoopWarning.Kind.CLUSTERED_CROSSINGS && x.message().contains("noise")), noisy.warnings().toString());
        assertTrue(ClosedLoopStability.of(MeasuredLoop.ofArrays(w, re, im).withOpenLoopUnstablePoles(0)).isStable());
    }

    /** A measured loop needs two points and finite non-zero values; messages name the index. */
    @Test
    void badArraysRejected() {
        assertThrows(IllegalArgumentException.class, () -> Margins.ofArrays(new double[] {1}, new double[] {1}, new double[] {0}));
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> Margins.ofArrays(new double[] {1, 2, 2}, new double[] {1, 1, 1}, new double[] {0, 0, 0}));
        assertTrue(e.getMessage().contains("index 2"), e.getMessage());
        e = assertThrows(IllegalArgumentException.class,
                () -> Margins.ofArrays(new double[] {1, 2}, new double[] {1, Double.NaN}, new double[] {0, 0}));
        assertTrue(e.getMessage().contains("index 1"), e.getMessage());
        assertThrows(IllegalArgumentException.class, () -> Margins.ofArrays(new double[] {1, 2}, new double[] {1}, new double[] {0, 0}));
    }
}
