package org.loopledger.control;

import org.loopledger.lti.TimeBase;
import org.loopledger.lti.TransferFunction;

import java.util.ArrayList;
import java.util.List;
import java.util.Objects;

/**
 * Filters in series on the current command (after the velocity controller), applied in list order.
 * Frequency responses are evaluated factor by factor, never through the expanded product polynomial,
 * which loses accuracy beyond order 6 or so. Immutable (the list is copied).
 */
public record FilterChain(List<Filter> filters) {
    private static final FilterChain NONE = new FilterChain(List.of());

    public FilterChain {
        Objects.requireNonNull(filters, "filters");
        filters = List.copyOf(filters);
    }

    public static FilterChain none() { return NONE; }

    public static FilterChain of(Filter... filters) { return new FilterChain(List.of(filters)); }

    /** This chain followed by {@code f}. */
    public FilterChain then(Filter f) {
        List<Filter> l = new ArrayList<>(filters);
        l.add(Objects.requireNonNull(f, "filter"));
        return new FilterChain(l);
    }

    public boolean isEmpty() { return filters.isEmpty(); }

    public int size() { return filters.size(); }

    /** The expanded product ∏H<sub>i</sub>(s) (1 for an empty chain); for display and model algebra, not for evaluation. */
    public TransferFunction continuous() {
        TransferFunction t = TransferFunction.gain(1.0);
        for (Filter f : filters) t = t.times(f.continuous());
        return t;
    }

    /** The expanded product ∏H<sub>i</sub>(z) at {@code sampleRateHz} (1 for an empty chain). */
    public TransferFunction discrete(double sampleRateHz) {
        TransferFunction t = TransferFunction.gain(1.0, TimeBase.sampledAtHz(sampleRateHz));
        for (Filter f : filters) t = t.times(f.discrete(sampleRateHz));
        return t;
    }

    /** Throws naming the first filter frequency at or above the Nyquist frequency of {@code sampleRateHz}. */
    public void requireBelowNyquist(double sampleRateHz) {
        for (Filter f : filters) f.requireBelowNyquist(sampleRateHz);
    }

    /**
     * Multiplies {@code re + j·im} (modified) by ∏H<sub>i</sub>(jω) on {@code omegaRadPerS} (not modified), factor by factor.
     */
    public void multiplyContinuous(double[] omegaRadPerS, double[] re, double[] im) {
        for (Filter f : filters) ComplexArrays.multiplyBy(f.continuous(), omegaRadPerS, re, im);
    }

    /** Multiplies {@code re + j·im} (modified) by ∏H<sub>i</sub>(e<sup>jωT</sup>) at {@code sampleRateHz}; ω must not exceed Nyquist. */
    public void multiplyDiscrete(double sampleRateHz, double[] omegaRadPerS, double[] re, double[] im) {
        for (Filter f : filters) ComplexArrays.multiplyBy(f.discrete(sampleRateHz), omegaRadPerS, re, im);
    }

    /** The drive's coefficients, one row per filter, at {@code sampleRateHz}. */
    public CoefficientTable coefficientTable(double sampleRateHz) {
        List<CoefficientTable.Row> rows = new ArrayList<>();
        for (Filter f : filters) rows.add(new CoefficientTable.Row(f, f.coefficients(sampleRateHz)));
        return new CoefficientTable(sampleRateHz, rows);
    }

    @Override public String toString() {
        if (filters.isEmpty()) return "no filters";
        StringBuilder sb = new StringBuilder();
        for (Filter f : filters) sb.append(sb.length() == 0 ? "" : " → ").append(f.describe());
        return sb.toString();
    }
}
