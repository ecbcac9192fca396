package org.loopledger.sim;

import org.loopledger.lti.Motion;
import org.loopledger.lti.Units;

import java.util.Objects;
import java.util.OptionalDouble;

/**
 * Figures of a {@link TimeResponse}. Definitions (y is the position for position excitations, the velocity for a
 * velocity step; the target is the step amplitude):
 * <ul>
 *   <li><b>rise time</b>: from the first crossing of 10 % to the first crossing of 90 % of the target, crossings
 *       interpolated linearly between samples (steps only);</li>
 *   <li><b>overshoot</b>: max(0, max(y/target) - 1)·100 % (steps only);</li>
 *   <li><b>settling time</b>: the first sample time after which |y - target| stays within 2 % of |target| to the end
 *       of the record (for a disturbance step: |position| within 2 % of its peak); empty when still outside at the end;</li>
 *   <li><b>peak following error</b>: max |following error| (for a disturbance, the peak position deviation);</li>
 *   <li><b>final following error</b>: the following error at the last sample (the ramp's steady-state lag);</li>
 *   <li><b>peak current</b>: max |current command|.</li>
 * </ul>
 */
public record ResponseMetrics(Excitation excitation, OptionalDouble riseTimeS, OptionalDouble overshootPct, OptionalDouble settlingTimeS,
                              double peakFollowingError, double finalFollowingError, double peakCurrent, double recordLengthS, Motion motion) {
    /** A rotary axis. */
    public ResponseMetrics(Excitation excitation, OptionalDouble riseTimeS, OptionalDouble overshootPct, OptionalDouble settlingTimeS,
                           double peakFollowingError, double finalFollowingError, double peakCurrent, double recordLengthS) {
        this(excitation, riseTimeS, overshootPct, settlingTimeS, peakFollowingError, finalFollowingError, peakCurrent, recordLengthS, Motion.ROTARY);
    }

    /** The settling band, 2 % of the target. */
    public static final double SETTLING_BAND = 0.02;

    public ResponseMetrics {
        Objects.requireNonNull(excitation, "excitation");
        Objects.requireNonNull(riseTimeS, "riseTimeS");
        Objects.requireNonNull(overshootPct, "overshootPct");
        Objects.requireNonNull(settlingTimeS, "settlingTimeS");
        Objects.requireNonNull(motion, "motion (Motion.ROTARY or Motion.LINEAR)");
    }

    static ResponseMetrics of(TimeResponse r) {
        double[] t = r.timeS(), fe = r.followingError(), cur = r.current();
        double peakFe = 0, peakI = 0;
        for (double v : fe) peakFe = Math.max(peakFe, Math.abs(v));
        for (double v : cur) peakI = Math.max(peakI, Math.abs(v));
        double finalFe = fe[fe.length - 1];
        OptionalDouble rise = OptionalDouble.empty(), over = OptionalDouble.empty(), settle = OptionalDouble.empty();
        switch (r.excitation()) {
            case POSITION_STEP, VELOCITY_STEP -> {
                double[] y = r.excitation() == Excitation.POSITION_STEP ? r.positionRad() : r.velocityRadPerS();
                double target = r.amplitude();
                double[] yn = new double[y.length];
                for (int i = 0; i < y.length; i++) yn[i] = y[i] / target;
                OptionalDouble t10 = crossing(t, yn, 0.1), t90 = crossing(t, yn, 0.9);
                if (t10.isPresent() && t90.isPresent()) rise = OptionalDouble.of(t90.getAsDouble() - t10.getAsDouble());
                double max = Double.NEGATIVE_INFINITY;
                for (double v : yn) max = Math.max(max, v);
                over = OptionalDouble.of(Math.max(0, max - 1) * 100);
                settle = settling(t, yn, 1.0, SETTLING_BAND);
            }
            case TORQUE_DISTURBANCE_STEP -> {
                double[] x = r.positionRad();
                double peak = 0;
                for (double v : x) peak = Math.max(peak, Math.abs(v));
                if (peak > 0) {
                    double[] xn = new double[x.length];
                    for (int i = 0; i < x.length; i++) xn[i] = x[i] / peak;
                    settle = settling(t, xn, 0.0, SETTLING_BAND);
                }
            }
            case POSITION_RAMP -> { }
        }
        return new ResponseMetrics(r.excitation(), rise, over, settle, peakFe, finalFe, peakI, r.durationS(), r.motion());
    }

    private static OptionalDouble crossing(double[] t, double[] y, double level) {
        if (y[0] >= level) return OptionalDouble.of(t[0]);
        for (int i = 1; i < y.length; i++) {
            if (y[i] >= level) return OptionalDouble.of(t[i - 1] + (level - y[i - 1]) / (y[i] - y[i - 1]) * (t[i] - t[i - 1]));
        }
        return OptionalDouble.empty();
    }

    private static OptionalDouble settling(double[] t, double[] y, double target, double band) {
        int last = -1;
        for (int i = 0; i < y.length; i++) if (Math.abs(y[i] - target) > band) last = i;
        if (last == y.length - 1) return OptionalDouble.empty();
        return OptionalDouble.of(last < 0 ? t[0] : t[last + 1]);
    }

    private static String ms(OptionalDouble v) { return v.isPresent() ? Units.g4(v.getAsDouble() * 1e3) + " ms" : "n/a"; }

    @Override public String toString() {
        String unit = excitation.errorUnit(motion);
        StringBuilder sb = new StringBuilder();
        if (excitation == Excitation.POSITION_STEP || excitation == Excitation.VELOCITY_STEP) {
            sb.append("rise time (10-90 %) ").append(ms(riseTimeS)).append(", overshoot ")
                    .append(overshootPct.isPresent() ? Units.g4(overshootPct.getAsDouble()) + " %" : "n/a").append(", ");
        }
        if (excitation != Excitation.POSITION_RAMP) {
            sb.append(excitation == Excitation.TORQUE_DISTURBANCE_STEP ? "recovery (2 % of peak) " : "settling (2 % band) ")
                    .append(settlingTimeS.isPresent() ? ms(settlingTimeS) : "not settled within " + Units.g4(recordLengthS) + " s").append(", ");
        }
        sb.append(excitation == Excitation.TORQUE_DISTURBANCE_STEP ? "peak deviation " : "peak following error ")
                .append(Units.g4(peakFollowingError)).append(' ').append(unit);
        if (excitation == Excitation.POSITION_RAMP) sb.append(", final following error ").append(Units.g4(finalFollowingError)).append(' ').append(unit);
        sb.append(", peak current ").append(Units.g4(peakCurrent));
        return sb.toString();
    }
}
