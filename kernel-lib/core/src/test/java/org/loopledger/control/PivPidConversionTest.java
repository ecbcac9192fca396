package org.loopledger.control;

import org.apache.commons.math3.complex.Complex;
import org.junit.jupiter.api.Test;
import org.loopledger.lti.TransferFunction;

import java.util.Random;

import static org.junit.jupiter.api.Assertions.*;

/**
 * PIV ↔ PID conversion. References: the algebra in {@link Piv} and {@link Pid} (derivation by hand:
 * C<sub>eq</sub> = K<sub>v</sub>(s + ω<sub>i</sub>)(s + K<sub>p</sub>)/s expanded, and N(s) of the filtered PID), checked here
 * on the transfer functions themselves at several frequencies, not only on the gains.
 */
class PivPidConversionTest {
    private static final double[] PROBE = {0.3, 3, 30, 300, 3000, 30000};

    private static double logUniform(Random r, double lo, double hi) { return lo * Math.pow(hi / lo, r.nextDouble()); }

    private static void assertSameResponse(TransferFunction a, TransferFunction b, double tol, String what) {
        for (double w : PROBE) {
            Complex x = a.response(w), y = b.response(w);
            assertEquals(0, x.subtract(y).abs() / y.abs(), tol, what + " at " + w + " rad/s: " + x + " vs " + y);
        }
    }

    @Test void pivToPidToPivRoundTripOnSeededRandomGains() {
        Random r = new Random(20240501L); // fixed seed: the same 500 cases on every machine
        int converted = 0;
        for (int n = 0; n < 500; n++) {
            double kp = logUniform(r, 5, 800), kv = logUniform(r, 1e-3, 20), wi = logUniform(r, 0.5, 800);
            // Near-equal zeros make a double root: its computed position is only good to sqrt(eps), so keep them 5 % apart
            // (then the quadratic's rounding error stays below about 1e-14 relative; tolerance 1e-11 leaves a margin).
            if (Math.abs(kp - wi) < 0.05 * Math.max(kp, wi)) continue;
            double tau = r.nextBoolean() ? 0 : 1.0 / (Math.max(kp, wi) * logUniform(r, 1.5, 50));
            Piv piv = Piv.of(kp, VelocityPi.ofRadPerS(kv, wi));
            Pid pid = piv.toPid(tau);
            // The PID equals C_eq·1/(τs + 1) (definition of the filtered PID, derivation by hand).
            TransferFunction expected = piv.equivalentSingleLoop();
            if (tau > 0) expected = expected.times(LowPass1.ofRadPerS(1 / tau).continuous());
            assertSameResponse(pid.continuous(), expected, 1e-12, "PID vs PIV·low-pass");
            ZeroAssignment za = wi < kp ? ZeroAssignment.INTEGRAL_CORNER_IS_LOWER_ZERO : ZeroAssignment.POSITION_GAIN_IS_LOWER_ZERO;
            PidAsPiv back = pid.toPiv(za);
            assertEquals(kp, back.piv().positionGainPerS(), 1e-11 * kp);
            assertEquals(kv, back.piv().velocity().velocityGain(), 1e-11 * kv);
            assertEquals(wi, back.piv().velocity().integralCornerRadPerS(), 1e-11 * wi);
            assertEquals(tau > 0, back.lowPass().isPresent());
            back.lowPass().ifPresent(lp -> assertEquals(1 / tau, lp.cornerRadPerS(), 1e-12 / tau));
            converted++;
        }
        assertTrue(converted > 400, "enough cases ran: " + converted);
    }

    @Test void pidToPivToPidRoundTripAndComplexRootsAreNamed() {
        Random r = new Random(77L);
        int real = 0, complex = 0;
        for (int n = 0; n < 400; n++) {
            double kp = logUniform(r, 0.1, 100), ki = logUniform(r, 1, 1e5), kd = logUniform(r, 1e-4, 1);
            double tau = r.nextBoolean() ? 0 : logUniform(r, 1e-5, 1e-3);
            Pid pid = Pid.withTimeConstant(kp, ki, kd, tau);
            double a = kp * tau + kd, b = kp + ki * tau, c = ki;
            double disc = b * b - 4 * a * c;
            if (Math.abs(disc) < 0.1 * b * b) continue; // keep clear of the double root (see above)
            if (disc > 0) {
                Pid again = pid.toPiv(ZeroAssignment.INTEGRAL_CORNER_IS_LOWER_ZERO).piv().toPid(tau);
                assertEquals(kp, again.proportionalGain(), 1e-11 * kp);
                assertEquals(ki, again.integralGain(), 1e-11 * ki);
                assertEquals(kd, again.derivativeGain(), 1e-10 * a); // KD = a - KP·τ: error relative to a
                real++;
            } else {
                IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> pid.toPiv(ZeroAssignment.INTEGRAL_CORNER_IS_LOWER_ZERO));
                assertTrue(e.getMessage().contains("complex roots"), e.getMessage());
                complex++;
            }
        }
        assertTrue(real > 50 && complex > 50, "both kinds exercised: " + real + " real, " + complex + " complex");
    }

    @Test void complexRootMessageGivesTheRoots() {
        // N(s) = 0.01 s² + s + 1000: roots -50 ± j·312.25 rad/s (quadratic formula by hand: sqrt(40 - 1)/0.02 = 312.25).
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> Pid.ideal(1, 1000, 0.01).toPiv(ZeroAssignment.INTEGRAL_CORNER_IS_LOWER_ZERO));
        assertTrue(e.getMessage().contains("-50 ± j312.2"), e.getMessage());
    }

    @Test void zeroAssignmentSwapsTheTwoZeros() {
        Pid pid = Piv.of(200, 0.05, 10).toPid(); // ωi = 62.83 rad/s < Kp = 200 1/s
        Piv a = pid.toPiv(ZeroAssignment.INTEGRAL_CORNER_IS_LOWER_ZERO).piv();
        Piv b = pid.toPiv(ZeroAssignment.POSITION_GAIN_IS_LOWER_ZERO).piv();
        assertEquals(200, a.positionGainPerS(), 1e-9);
        assertEquals(10, a.velocity().integralCornerHz(), 1e-11);
        assertEquals(2 * Math.PI * 10, b.positionGainPerS(), 1e-9);
        assertEquals(200, b.velocity().integralCornerRadPerS(), 1e-9);
        // Both have the same single-loop transfer function (the zeros commute).
        assertSameResponse(a.equivalentSingleLoop(), b.equivalentSingleLoop(), 1e-13, "swapped zeros");
    }

    /**
     * A drive's PIV with its integral corner above its position gain (Kp = 50 1/s, ωi = 2π·20 = 125.7 rad/s, Kv = 0.3):
     * the fixed rule "corner is the lower zero" swaps them; it must say so, and the nearest-Kp conversion must not swap.
     * Closed form (by hand, common practice for the PIV cascade): C_eq = Kv(1 + ωi/s)(s + Kp) = Kv(s + ωi)(s + Kp)/s, so
     * KP = Kv(ωi + Kp) = 0.3·175.66 = 52.70, KI = Kv·ωi·Kp = 0.3·125.66·50 = 1885, KD = Kv = 0.3, and N(s)/KD =
     * s² + (KP/KD)s + KI/KD has the roots -Kp and -ωi.
     */
    @Test void cornerAboveKpIsNotSilentlySwapped() {
        double kp = 50, wi = 2 * Math.PI * 20, kv = 0.3;
        Piv drive = Piv.of(kp, kv, 20);
        Pid pid = drive.toPid();
        assertEquals(kv * (wi + kp), pid.proportionalGain(), 1e-12 * pid.proportionalGain());
        assertEquals(kv * wi * kp, pid.integralGain(), 1e-12 * pid.integralGain());
        assertEquals(kv, pid.derivativeGain(), 0);
        PidAsPiv fixedRule = pid.toPiv(ZeroAssignment.INTEGRAL_CORNER_IS_LOWER_ZERO);
        assertEquals(wi, fixedRule.piv().positionGainPerS(), 1e-9 * wi, "the fixed rule takes the larger zero as Kp");
        assertEquals(1, fixedRule.warnings().size(), fixedRule.toString());
        assertEquals(PidWarning.Kind.ZEROS_INTERCHANGEABLE, fixedRule.warnings().get(0).kind());
        String w = fixedRule.warnings().get(0).message();
        assertTrue(w.contains("interchangeable") && w.contains("the other gives Kp = 50 1/s"), w);
        PidAsPiv nearest = pid.toPivNearestPositionGain(45); // the drive's Kp, roughly known
        assertEquals(kp, nearest.piv().positionGainPerS(), 1e-12 * kp);
        assertEquals(wi, nearest.piv().velocity().integralCornerRadPerS(), 1e-12 * wi);
        assertEquals(kv, nearest.piv().velocity().velocityGain(), 1e-12 * kv);
        assertTrue(nearest.piv().isCloseTo(drive, 1e-12), nearest.toString());
        assertFalse(fixedRule.piv().isCloseTo(drive, 1e-3));
        assertTrue(nearest.warnings().stream().noneMatch(x -> x.kind() == PidWarning.Kind.FAR_FROM_EXPECTED_POSITION_GAIN), nearest.toString());
        // an expectation far from both zeros is flagged
        assertTrue(pid.toPivNearestPositionGain(5000).warnings().stream().anyMatch(x -> x.kind() == PidWarning.Kind.FAR_FROM_EXPECTED_POSITION_GAIN && x.message().contains("factor of 2")));
        // round trip PID -> PIV -> PID: equal up to rounding, which isCloseTo accepts and equals need not
        Pid again = nearest.piv().toPid();
        assertTrue(again.isCloseTo(pid, 1e-12), again + " vs " + pid);
        assertFalse(again.isCloseTo(Pid.ideal(pid.proportionalGain() * 1.001, pid.integralGain(), pid.derivativeGain()), 1e-6));
    }

    @Test void pidWithoutIntegralGivesPivWithoutIntegral() {
        Pid pid = Pid.ideal(5, 0, 0.02); // N = 0.02 s² + 5 s = 0.02 s (s + 250)
        Piv p = pid.toPiv(ZeroAssignment.INTEGRAL_CORNER_IS_LOWER_ZERO).piv();
        assertEquals(0, p.velocity().integralCornerRadPerS());
        assertEquals(250, p.positionGainPerS(), 1e-12);
        assertEquals(0.02, p.velocity().velocityGain(), 1e-15);
    }

    @Test void tooSlowDerivativeFilterIsRejected() {
        // ωi = 125.7 rad/s, Kp = 300 1/s; a corner of 200 rad/s between them gives KD = Kv(1 - ωiτ)(1 - Kpτ) < 0.
        Piv piv = Piv.of(300, 0.05, 20);
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> piv.toPid(1.0 / 200));
        assertTrue(e.getMessage().contains("at least"), e.getMessage());
    }

    @Test void badGainsAreClearErrors() {
        assertThrows(IllegalArgumentException.class, () -> Piv.of(0, 0.1, 10));
        assertThrows(IllegalArgumentException.class, () -> Piv.of(-5, 0.1, 10));
        assertThrows(IllegalArgumentException.class, () -> Piv.of(50, 0, 10));
        assertThrows(IllegalArgumentException.class, () -> Piv.of(50, -0.1, 10));
        assertThrows(IllegalArgumentException.class, () -> Piv.of(50, 0.1, -1));
        assertThrows(IllegalArgumentException.class, () -> Piv.of(Double.NaN, 0.1, 1));
        assertThrows(IllegalArgumentException.class, () -> Pid.ideal(0, 1, 1));
        assertThrows(IllegalArgumentException.class, () -> Pid.ideal(1, -1, 1));
        assertThrows(IllegalArgumentException.class, () -> Pid.of(1, 1, 1, 0));
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> VelocityPi.of(-0.2, 5));
        assertTrue(e.getMessage().contains("-0.2"), e.getMessage());
        IllegalArgumentException f = assertThrows(IllegalArgumentException.class, () -> Pid.ideal(1, 0, 0).toPiv(ZeroAssignment.INTEGRAL_CORNER_IS_LOWER_ZERO));
        assertTrue(f.getMessage().contains("no s²"), f.getMessage());
    }

    @Test void discreteVelocityPiIsBackwardEuler() {
        // C(z) = Kv((1 + ωi T) z - 1)/(z - 1): at z → 1 it must behave as Kv ωi T/(z - 1), and its step response
        // u[k] = Kv(1 + ωi T (k + 1)) (backward Euler accumulation, definition).
        VelocityPi v = VelocityPi.ofRadPerS(0.5, 100);
        double t = 1e-4;
        TransferFunction cz = v.discrete(t);
        // Step response through the difference equation from the coefficients.
        double[] b = cz.numerator().coefficientsDescending(), a = cz.denominator().coefficientsDescending();
        double yPrev = 0, xPrev = 0;
        for (int k = 0; k < 20; k++) {
            double y = (b[0] * 1 + b[1] * xPrev - a[1] * yPrev) / a[0];
            assertEquals(0.5 * (1 + 100 * t * (k + 1)), y, 1e-14);
            yPrev = y;
            xPrev = 1;
        }
    }
}
