package org.loopledger.sim;

import org.loopledger.lti.Units;

import java.util.OptionalDouble;

/**
 * Figures of a step response y(t) (any units), taken relative to its initial value y<sub>0</sub> = y(t<sub>0</sub>)
 * and a steady-state value y<sub>∞</sub> (the DC gain times the step, or the last sample), with
 * Δ = y<sub>∞</sub> - y<sub>0</sub> and the normalised response r = (y - y<sub>0</sub>)/Δ. The same definitions as
 * {@link ResponseMetrics} (common practice):
 * <ul>
 *   <li><b>rise time</b>: from the first crossing of r = 0.1 to the first crossing of r = 0.9, interpolated linearly
 *       between samples; empty when either is not reached;</li>
 *   <li><b>overshoot</b>: max(0, max r - 1)·100 %;</li>
 *   <li><b>settling time</b>: the first sample time after which |r - 1| stays within the band (default 2 %) to the end of
 *       the record; empty when still outside at the end;</li>
 *   <li><b>peak</b>: the value of y farthest beyond y<sub>0</sub> in the direction of Δ, and its time.</li>
 * </ul>
 *
 * @param riseTimeS        10-90 % rise time in s
 * @param overshootPct     overshoot in % of Δ
 * @param settlingTimeS    settling time in s into ±{@code settlingBand}·|Δ|
 * @param peakValue        y at the peak (units of y)
 * @param peakTimeS        time of the peak in s
 * @param steadyStateValue y<sub>∞</sub> used
 * @param initialValue     y<sub>0</sub>
 * @param settlingBand     the settling band as a fraction of |Δ| (0.02 = 2 %)
 */
public record StepMetrics(OptionalDouble riseTimeS, double overshootPct, OptionalDouble settlingTimeS, double peakValue, double peakTimeS,
                          double steadyStateValue, double initialValue, double settlingBand) {
    /** The default settling band, 2 % (common practice; 5 % is the other usual choice). */
    public static final double DEFAULT_SETTLING_BAND = 0.02;

    /** Figures of {@code y} against {@code steadyStateValue} with a settling band (fraction of the step, 0 &lt; band &lt; 1). */
    public static StepMetrics of(TimeSeries y, double steadyStateValue, double settlingBand) {
        if (!(settlingBand > 0 && settlingBand < 1)) {
            throw new IllegalArgumentException("settling band must be a fraction in (0, 1) (0.02 for 2 %), got " + settlingBand);
        }
        if (!Double.isFinite(steadyStateValue)) {
            throw new IllegalArgumentException("steady-state value must be finite, got " + steadyStateValue + " (an unstable or integrating response has none)");
        }
        double[] t = y.timeS(), v = y.values();
        double y0 = v[0], delta = steadyStateValue - y0;
        if (delta == 0) {
            throw new IllegalArgumentException("the steady-state value equals the initial value " + Units.g4(y0) + ": no step to measure");
        }
        double[] r = new double[v.length];
        for (int i = 0; i < v.length; i++) r[i] = (v[i] - y0) / delta;
        int ip = 0;
        for (int i = 1; i < r.length; i++) if (r[i] > r[ip]) ip = i;
        OptionalDouble t10 = crossing(t, r, 0.1), t90 = crossing(t, r, 0.9);
        OptionalDouble rise = t10.isPresent() && t90.isPresent() ? OptionalDouble.of(t90.getAsDouble() - t10.getAsDouble()) : OptionalDouble.empty();
        int last = -1;
        for (int i = 0; i < r.length; i++) if (Math.abs(r[i] - 1) > settlingBand) last = i;
        OptionalDouble settle = last == r.length - 1 ? OptionalDouble.empty() : OptionalDouble.of(last < 0 ? t[0] : t[last + 1]);
        return new StepMetrics(rise, Math.max(0, r[ip] - 1) * 100, settle, v[ip], t[ip], steadyStateValue, y0, settlingBand);
    }

    static OptionalDouble crossing(double[] t, double[] r, double level) {
        if (r[0] >= level) return OptionalDouble.of(t[0]);
        for (int i = 1; i < r.length; i++) {
            if (r[i] >= level) return OptionalDouble.of(t[i - 1] + (level - r[i - 1]) / (r[i] - r[i - 1]) * (t[i] - t[i - 1]));
        }
        return OptionalDouble.empty();
    }

    private static String ms(OptionalDouble v) { return v.isPresent() ? Units.g4(v.getAsDouble() * 1e3) + " ms" : "not reached"; }

    @Override public String toString() {
        return "rise time (10-90 %) " + ms(riseTimeS) + ", overshoot " + Units.g4(overshootPct) + " %, settling (" + Units.g4(settlingBand * 100)
                + " % band) " + (settlingTimeS.isPresent() ? ms(settlingTimeS) : "not settled") + ", peak " + Units.g4(peakValue) + " at "
                + Units.g4(peakTimeS * 1e3) + " ms, steady state " + Units.g4(steadyStateValue);
    }
}
