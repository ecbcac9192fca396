package org.loopledger.sim;

import org.loopledger.control.BiquadCoefficients;
import org.loopledger.control.Filter;
import org.loopledger.control.FilterChain;
import org.loopledger.control.Piv;

import java.util.List;

/**
 * The drive's discrete controller, one call per sample: position P (optional), velocity PI with a backward-Euler
 * integral (as {@code VelocityPi.discrete}), the filters as biquad sections in transposed direct form II
 * (coefficients from {@link Filter#coefficients}), and the current clamp with the chosen anti-windup.
 */
final class DriveController {
    private final double kp, kv, wiT, limit;
    private final AntiWindup antiWindup;
    private final double[][] sections; // b0 b1 b2 a1 a2 per filter
    private final double[] s1, s2;
    private double integral;

    DriveController(Piv piv, FilterChain filters, double sampleRateHz, double currentLimit, AntiWindup antiWindup) {
        this.kp = piv.positionGainPerS();
        this.kv = piv.velocity().velocityGain();
        this.wiT = piv.velocity().integralCornerRadPerS() / sampleRateHz;
        this.limit = currentLimit;
        this.antiWindup = antiWindup;
        List<Filter> fs = filters.filters();
        sections = new double[fs.size()][];
        for (int i = 0; i < fs.size(); i++) {
            BiquadCoefficients c = fs.get(i).coefficients(sampleRateHz);
            sections[i] = c.toArray();
        }
        s1 = new double[fs.size()];
        s2 = new double[fs.size()];
    }

    double positionGain() { return kp; }

    /** The clamped current command for velocity error {@code e}; advances the controller's state. */
    double update(double e) {
        double iNew = integral + wiT * e;
        double y = filterPeek(kv * (e + iNew));
        if (Math.abs(y) > limit && antiWindup == AntiWindup.CONDITIONAL_INTEGRATION && e * y > 0) {
            iNew = integral; // freeze the integrator this sample
            y = filterPeek(kv * (e + iNew));
        }
        integral = iNew;
        filterCommit(kv * (e + iNew));
        return Math.max(-limit, Math.min(limit, y));
    }

    private double filterPeek(double x) {
        for (int i = 0; i < sections.length; i++) x = sections[i][0] * x + s1[i];
        return x;
    }

    private void filterCommit(double x) {
        for (int i = 0; i < sections.length; i++) {
            double[] c = sections[i];
            double y = c[0] * x + s1[i];
            s1[i] = c[1] * x - c[3] * y + s2[i];
            s2[i] = c[2] * x - c[4] * y;
            x = y;
        }
    }
}
