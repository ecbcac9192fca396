package org.loopledger.analysis;

import org.junit.jupiter.api.Test;
import org.loopledger.lti.TransferFunction;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Closed-loop bandwidth at a chosen threshold against the closed form of a first-order closed loop (hand derivation):
 * L = K/(s + a) gives T = K/(s + a + K), |T(jω)| = K/√(ω² + (a + K)²), so |T| falls to r·|T(0)| at
 * ω = (a + K)·√(1/r² - 1). With r = 1/√2 (the half-power point) ω = a + K.
 */
class BandwidthThresholdTest {
    static double closedForm(double a, double k, double thresholdDb) {
        double r = Math.pow(10, thresholdDb / 20);
        return (a + k) * Math.sqrt(1 / (r * r) - 1);
    }

    @Test void thresholdsOfAFirstOrderClosedLoop() {
        for (double a : new double[] {0, 3}) {
            double k = 50;
            TransferFunction l = TransferFunction.continuous(new double[] {k}, new double[] {1, a});
            // default: half power, ω = a + K exactly
            assertEquals(a + k, Margins.of(l).bandwidth().omegaRadPerS().getAsDouble(), 1e-9 * (a + k));
            for (double db : new double[] {Bandwidth.HALF_POWER_DB, -3, -6, -20}) {
                Bandwidth bw = Bandwidth.of(l, db);
                assertEquals(closedForm(a, k, db), bw.omegaRadPerS().getAsDouble(), 1e-9 * closedForm(a, k, db), "a = " + a + ", " + db + " dB");
                assertEquals(db, bw.thresholdDb(), 0);
            }
        }
        // exactly -3 dB is 0.24 % below the half-power point: ω = K·√(10^0.3 - 1)
        assertEquals(50 * Math.sqrt(Math.pow(10, 0.3) - 1), Bandwidth.of(TransferFunction.continuous(new double[] {50}, new double[] {1, 0}), -3)
                .omegaRadPerS().getAsDouble(), 1e-9 * 50);
    }

    @Test void aThresholdThatIsNotALossIsRefused() {
        TransferFunction l = TransferFunction.continuous(new double[] {50}, new double[] {1, 0});
        var e = assertThrows(IllegalArgumentException.class, () -> Bandwidth.of(l, 3));
        assertTrue(e.getMessage().contains("negative number of dB"), e.getMessage());
        assertTrue(Bandwidth.of(l, -6).toString().contains("-6 dB"), Bandwidth.of(l, -6).toString());
    }
}
