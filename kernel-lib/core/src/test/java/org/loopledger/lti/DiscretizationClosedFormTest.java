package org.loopledger.lti;

import org.apache.commons.math3.complex.Complex;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.stream.Stream;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Discretisation against closed forms and definitions (no SciPy needed).
 *
 * <p>ZOH closed forms come from G(z) = (1 - z<sup>-1</sup>) Z{G(s)/s}: the sampled step response
 * y<sub>k</sub> gives G(z) = Σ (y<sub>k</sub> - y<sub>k-1</sub>) z<sup>-k</sup> (derivation by hand;
 * the same results are tabulated in Franklin, Powell and Workman, Digital Control of Dynamic Systems,
 * 3rd ed., Appendix of z-transforms, from memory). Tolerance 1e-13 relative to the coefficient
 * vector's norm: the closed forms are evaluated with expm1 where it matters and lose at most a
 * factor (ωT)<sup>-1</sup> &lt; 20 to cancellation, so they are good to about 1e-15; 1e-13 leaves room
 * for the library's matrix exponential and polynomial reconstruction while still being ~3000 times
 * tighter than SciPy's own zoh error (about 3e-10).
 */
class DiscretizationClosedFormTest {

    static Stream<Arguments> zohClosedForms() {
        List<Arguments> rows = new ArrayList<>();
        {   // a/(s+a): (1 - α)/(z - α), α = e^{-aT}
            double a = 2, t = 0.01, al = Math.exp(-a * t), one = -Math.expm1(-a * t);
            rows.add(Arguments.of("a/(s+a), a = 2, T = 0.01", TransferFunction.continuous(new double[] {a}, new double[] {1, a}), t,
                    new double[] {one}, new double[] {1, -al}));
        }
        {   // 1/((s+a)(s+b)), a ≠ b: partial fractions of 1/(s(s+a)(s+b)), derivation by hand:
            // b1 = [b(1-α) - a(1-β)]/(ab(b-a)),  b0 = [αβ(a-b) + bβ - aα]/(ab(a-b))... written over (z-α)(z-β)
            double a = 1, b = 3, t = 0.1, al = Math.exp(-a * t), be = Math.exp(-b * t);
            double oa = -Math.expm1(-a * t), ob = -Math.expm1(-b * t);
            double b1 = (b * oa - a * ob) / (a * b * (b - a));
            double b0 = (al * be * (a - b) + b * be - a * al) / (a * b * (a - b));
            rows.add(Arguments.of("1/((s+1)(s+3)), T = 0.1", TransferFunction.continuous(new double[] {1}, new double[] {1, a + b, a * b}), t,
                    new double[] {b1, b0}, new double[] {1, -(al + be), al * be}));
        }
        for (double[] p : new double[][] {{10, 0.3, 0.01}, {2 * Math.PI * 300, 0.05, 1 / 16000.0}, {5, 0.7, 0.2}}) {
            // ω²/(s² + 2ζωs + ω²), ζ < 1: step response y = 1 - e^{-σt}(cos ω_d t + (σ/ω_d) sin ω_d t),
            // b1 = y1, b2 = e^{-2σT} + e^{-σT}((σ/ω_d) sin ω_d T - cos ω_d T), den z² - 2e^{-σT}cos(ω_d T) z + e^{-2σT}
            double w = p[0], zeta = p[1], t = p[2];
            double sg = zeta * w, wd = w * Math.sqrt(1 - zeta * zeta), e = Math.exp(-sg * t);
            double cs = Math.cos(wd * t), sn = Math.sin(wd * t);
            double b1 = 1 - e * (cs + sg / wd * sn);
            double b2 = e * e + e * (sg / wd * sn - cs);
            rows.add(Arguments.of("ω²/(s²+2ζωs+ω²), ω = " + Units.g4(w) + ", ζ = " + zeta + ", T = " + Units.g4(t),
                    TransferFunction.continuous(new double[] {w * w}, new double[] {1, 2 * zeta * w, w * w}), t,
                    new double[] {b1, b2}, new double[] {1, -2 * e * cs, e * e}));
        }
        {   // integrator 1/s: T/(z - 1) (Franklin, Powell and Workman, 3rd ed., from memory; derivation by hand)
            double t = 0.001;
            rows.add(Arguments.of("1/s, T = 1 ms", TransferFunction.continuous(new double[] {1}, new double[] {1, 0}), t,
                    new double[] {t}, new double[] {1, -1}));
        }
        {   // double integrator 1/s²: T²(z + 1)/(2(z - 1)²) (same book, the classic satellite example, from memory)
            double t = 0.1;
            rows.add(Arguments.of("1/s², T = 0.1", TransferFunction.continuous(new double[] {1}, new double[] {1, 0, 0}), t,
                    new double[] {t * t / 2, t * t / 2}, new double[] {1, -2, 1}));
        }
        {   // rigid body at a drive's 16 kHz: 1/s² with T = 62.5 µs, numerator ~2e-9 (tests the numerator's own accuracy)
            double t = 1 / 16000.0;
            rows.add(Arguments.of("1/s², T = 62.5 µs", TransferFunction.continuous(new double[] {1}, new double[] {1, 0, 0}), t,
                    new double[] {t * t / 2, t * t / 2}, new double[] {1, -2, 1}));
        }
        {   // biproper (s + c)/(s + a) = 1 + (c - a)/(s + a): num (z - α) + (c - a)(1 - α)/a, den z - α
            double a = 4, c = 0.5, t = 0.05, al = Math.exp(-a * t), one = -Math.expm1(-a * t);
            rows.add(Arguments.of("(s+0.5)/(s+4), T = 0.05", TransferFunction.continuous(new double[] {1, c}, new double[] {1, a}), t,
                    new double[] {1, -al + (c - a) * one / a}, new double[] {1, -al}));
        }
        return rows.stream();
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("zohClosedForms")
    void zohMatchesClosedForm(String name, TransferFunction g, double t, double[] num, double[] den) {
        TransferFunction d = Discretization.zoh(g, t);
        assertEquals(TimeBase.sampled(t), d.timeBase());
        assertCoefficientsClose(num, den, d, 1e-13, name);
        // The numerator on its own, too: with a fast sample rate it is tiny next to the denominator, and an
        // error hidden by the joint norm above would still shift the DC gain and the zeros.
        double[] gotNum = d.numerator().coefficientsDescending();
        double e = Math.sqrt(DiscretizationScipyTest.distance(num, gotNum) / DiscretizationScipyTest.sumSq(num));
        assertTrue(e <= 1e-12, name + ": numerator relative error " + e + " (got " + Arrays.toString(gotNum) + ")");
    }

    @Test
    void zohCarriesTheDelayAndScalesWithGain() {
        // A delay stays a delay term (DESIGN: exact in the frequency domain); gain is linear.
        TransferFunction g = TransferFunction.continuous(new double[] {3}, new double[] {1, 2}).withDelay(0.0025);
        TransferFunction d = Discretization.zoh(g, 0.001);
        assertEquals(0.0025, d.delayS());
        TransferFunction d1 = Discretization.zoh(g.withoutDelay().times(1 / 3.0), 0.001);
        assertCoefficientsClose(d.numerator().times(1 / 3.0).coefficientsDescending(), d.denominator().coefficientsDescending(), d1, 1e-15, "gain");
    }

    /** Tustin of a/(s+a) by hand: a T (z + 1) / ((2 + aT) z - (2 - aT)). */
    @Test
    void tustinFirstOrderByHand() {
        double a = 3, t = 0.02;
        TransferFunction d = Discretization.tustin(TransferFunction.continuous(new double[] {a}, new double[] {1, a}), t);
        double k = 2 + a * t;
        assertCoefficientsClose(new double[] {a * t / k, a * t / k}, new double[] {1, -(2 - a * t) / k}, d, 1e-15, "tustin a/(s+a)");
    }

    /** Prewarping makes the discrete response equal the continuous one at ω_p (its definition). */
    @Test
    void prewarpedTustinIsExactAtThePrewarpFrequency() {
        TransferFunction g = TransferFunction.continuous(new double[] {400}, new double[] {1, 8, 400});
        double t = 0.01, wp = 20; // resonance at 20 rad/s, Nyquist 314 rad/s
        Complex exact = g.response(wp);
        Complex pre = Discretization.tustin(g, t, wp).response(wp);
        Complex plain = Discretization.tustin(g, t).response(wp);
        assertTrue(pre.subtract(exact).abs() < 1e-12 * exact.abs(), "prewarped " + pre + " vs " + exact);
        assertTrue(plain.subtract(exact).abs() > 1e-4 * exact.abs(), "plain Tustin should warp: " + plain + " vs " + exact);
    }

    // ------------------------------ matched pole-zero --------------------------------------------

    static Stream<Arguments> matchedCases() {
        return Stream.of(
                // (system, T, match frequency or NaN for DC, source)
                Arguments.of(TransferFunction.continuous(new double[] {2, 6}, new double[] {1, 3, 20}), 0.01, Double.NaN,
                        "definition: z = e^{sT}, DC gain matched; Franklin, Powell and Workman 3rd ed. §6.3.3 (from memory)"),
                Arguments.of(TransferFunction.continuous(new double[] {-5, 10}, new double[] {1, 7, 10, 0}), 0.005, 1.0,
                        "pole at s = 0: gain matched at the stated 1 rad/s"),
                Arguments.of(TransferFunction.continuous(new double[] {1, 0}, new double[] {1, 4, 13}), 0.02, 3.0,
                        "zero at s = 0: gain matched at the stated 3 rad/s"),
                Arguments.of(TransferFunction.continuous(new double[] {-1, 2}, new double[] {1, 2}), 0.1, Double.NaN,
                        "biproper, right-half-plane zero, DC gain 1 (sign preserved)"));
    }

    @ParameterizedTest(name = "matched: {3}")
    @MethodSource("matchedCases")
    void matchedPoleZeroFollowsItsDefinition(TransferFunction g, double t, double matchRadPerS, String source) {
        TransferFunction d = Double.isNaN(matchRadPerS) ? Discretization.matched(g, t) : Discretization.matched(g, t, matchRadPerS);
        List<Complex> wantPoles = new ArrayList<>(), wantZeros = new ArrayList<>();
        for (Complex p : g.poles()) wantPoles.add(p.multiply(t).exp());
        for (Complex z : g.zeros()) wantZeros.add(z.multiply(t).exp());
        for (int k = 0; k < g.relativeDegree(); k++) wantZeros.add(new Complex(-1, 0)); // zeros at infinity go to z = -1
        // Compared as polynomials ∏(z - e^{p T}), not as roots: mapped poles crowd near z = 1, where root
        // finding is ill conditioned, while the coefficients are well determined.
        double[] want = Polynomial.ofRoots(wantPoles.toArray(Complex[]::new)).coefficientsDescending();
        double[] wantNum = Polynomial.ofRoots(wantZeros.toArray(Complex[]::new)).coefficientsDescending();
        double[] gotNum = d.numerator().times(1 / d.numerator().leading()).coefficientsDescending();
        assertCoefficientsClose(wantNum, want, TransferFunction.of(Polynomial.ofDescending(gotNum), d.denominator(), d.timeBase()),
                1e-13, source);
        if (Double.isNaN(matchRadPerS)) {
            assertEquals(g.dcGain(), d.dcGain(), 1e-12 * Math.abs(g.dcGain()), source);
        } else {
            Complex a = g.response(matchRadPerS), b = d.response(matchRadPerS);
            assertEquals(a.abs(), b.abs(), 1e-12 * a.abs(), source);
            assertTrue(a.getReal() * b.getReal() + a.getImaginary() * b.getImaginary() > 0, "same sign of the gain: " + a + " vs " + b);
        }
    }

    @Test
    void matchedAtDcRefusesAPoleOrZeroAtTheOrigin() {
        TransferFunction integrator = TransferFunction.continuous(new double[] {1}, new double[] {1, 1, 0});
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> Discretization.matched(integrator, 0.01));
        assertTrue(e.getMessage().contains("s = 0") && e.getMessage().contains("matchRadPerS"), e.getMessage());
        IllegalArgumentException e2 = assertThrows(IllegalArgumentException.class, () -> Discretization.matched(integrator, 0.01, 0.0));
        assertTrue(e2.getMessage().contains("0"), e2.getMessage());
    }

    static void assertCoefficientsClose(double[] num, double[] den, TransferFunction d, double tol, String what) {
        double err = DiscretizationScipyTest.distance(num, d.numerator().coefficientsDescending())
                + DiscretizationScipyTest.distance(den, d.denominator().coefficientsDescending());
        double rel = Math.sqrt(err / (DiscretizationScipyTest.sumSq(num) + DiscretizationScipyTest.sumSq(den)));
        assertTrue(rel <= tol, what + ": relative coefficient error " + rel + "; got " + d + ", expected num "
                + Arrays.toString(num) + " den " + Arrays.toString(den));
    }
}
