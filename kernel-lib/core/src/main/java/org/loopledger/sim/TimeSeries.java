package org.loopledger.sim;

import org.loopledger.lti.Units;

import java.util.Arrays;

/**
 * A sampled signal: {@code values[k]} at {@code timeS[k]} seconds (same length, at least one sample, times finite
 * and strictly increasing). The values carry the unit of whatever they describe (a system's output for an input in
 * its own units). Immutable: arrays are copied in and out.
 */
public record TimeSeries(double[] timeS, double[] values) {
    public TimeSeries {
        if (timeS == null || values == null) throw new IllegalArgumentException("a time series needs both timeS and values (got null)");
        if (timeS.length != values.length) {
            throw new IllegalArgumentException("timeS has " + timeS.length + " entries but values has " + values.length + "; give one value per instant");
        }
        if (timeS.length == 0) throw new IllegalArgumentException("a time series needs at least one sample");
        for (int i = 0; i < timeS.length; i++) {
            if (!Double.isFinite(timeS[i])) throw new IllegalArgumentException("timeS[" + i + "] is " + timeS[i] + "; every instant must be finite");
            if (i > 0 && !(timeS[i] > timeS[i - 1])) {
                throw new IllegalArgumentException("timeS must increase strictly: timeS[" + i + "] = " + timeS[i] + " follows " + timeS[i - 1]);
            }
        }
        timeS = timeS.clone();
        values = values.clone();
    }

    @Override public double[] timeS() { return timeS.clone(); }

    @Override public double[] values() { return values.clone(); }

    public int size() { return timeS.length; }

    public double timeS(int k) { return timeS[k]; }

    public double value(int k) { return values[k]; }

    /** The last value. */
    public double finalValue() { return values[values.length - 1]; }

    /**
     * Step figures with the last sample as steady-state value and the default 2 % settling band
     * (see {@link StepMetrics} for the definitions).
     */
    public StepMetrics stepMetrics() { return StepMetrics.of(this, finalValue(), StepMetrics.DEFAULT_SETTLING_BAND); }

    /** Step figures against a known steady-state value (for example the DC gain) and a settling band (0.02 = 2 %). */
    public StepMetrics stepMetrics(double steadyStateValue, double settlingBand) { return StepMetrics.of(this, steadyStateValue, settlingBand); }

    @Override public boolean equals(Object o) {
        return o instanceof TimeSeries t && Arrays.equals(t.timeS, timeS) && Arrays.equals(t.values, values);
    }

    @Override public int hashCode() { return 31 * Arrays.hashCode(timeS) + Arrays.hashCode(values); }

    @Override public String toString() {
        return "TimeSeries[" + timeS.length + " samples, " + Units.g4(timeS[0]) + " .. " + Units.g4(timeS[timeS.length - 1]) + " s]";
    }
}
