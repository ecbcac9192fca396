package org.loopledger.lti;

import org.apache.commons.math3.complex.Complex;
import org.junit.jupiter.api.Test;

import java.lang.management.ManagementFactory;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotSame;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

/**
 * Invariants in the style of EJML's generic checks: arrays passed in are not modified, arrays handed
 * out are copies (changing them changes nothing inside), and the grid evaluation allocates nothing.
 */
class LtiInvariantsTest {

    @Test
    void constructorsCopyTheirInputs() {
        double[] num = {2, 4}, den = {2, 6, 4};
        TransferFunction g = TransferFunction.continuous(num, den);
        assertArrayEquals(new double[] {2, 4}, num);      // not normalised in place
        assertArrayEquals(new double[] {2, 6, 4}, den);
        num[0] = 99;
        den[1] = 99;
        assertArrayEquals(new double[] {1, 2}, g.numerator().coefficientsDescending());
        assertArrayEquals(new double[] {1, 3, 2}, g.denominator().coefficientsDescending());
    }

    @Test
    void returnedCoefficientArraysAreCopies() {
        Polynomial p = Polynomial.ofDescending(1, -3, 2);
        double[] c = p.coefficientsDescending();
        assertNotSame(c, p.coefficientsDescending());
        c[0] = 42;
        assertEquals(1.0, p.leading());
        assertEquals(2, p.roots().size());
    }

    @Test
    void responseLeavesTheGridAlone() {
        TransferFunction g = TransferFunction.continuous(new double[] {1}, new double[] {1, 1, 1});
        double[] w = {0.1, 1, 10}, keep = w.clone();
        double[] re = new double[3], im = new double[3];
        g.response(w, re, im);
        assertArrayEquals(keep, w);
    }

    @Test
    void operationsLeaveTheirOperandsAlone() {
        TransferFunction a = TransferFunction.continuous(new double[] {1, 2}, new double[] {1, 3, 5});
        TransferFunction b = TransferFunction.continuous(new double[] {3}, new double[] {1, 7});
        TransferFunction a0 = TransferFunction.continuous(new double[] {1, 2}, new double[] {1, 3, 5});
        TransferFunction b0 = TransferFunction.continuous(new double[] {3}, new double[] {1, 7});
        a.times(b); a.plus(b); a.feedback(b); a.inverse(); a.minimal(1e-3); a.negate(); a.withDelay(0.1);
        Discretization.zoh(a, 0.01); Discretization.tustin(a, 0.01, 5); Discretization.matched(a, 0.01);
        Pade.replacingDelay(a.withDelay(0.01), 3);
        assertEquals(a0, a);
        assertEquals(b0, b);
    }

    @Test
    void stateSpaceHandsOutCopies() {
        StateSpace ss = StateSpace.controllableCanonical(TransferFunction.continuous(new double[] {1}, new double[] {1, 3, 2}));
        double[][] a = ss.a();
        a[0][0] = 1e9;
        ss.b()[0] = 1e9;
        assertEquals(-3.0, ss.a()[0][0]);
        assertEquals(1.0, ss.b()[0]);
        double[][] in = {{0, 1}, {-2, -3}};
        StateSpace s2 = StateSpace.of(in, new double[] {0, 1}, new double[] {1, 0}, 0, TimeBase.continuous());
        in[0][1] = 7;
        assertEquals(1.0, s2.a()[0][1]);
    }

    @Test
    void rootsAreConjugateSymmetricValues() {
        List<Complex> r = Polynomial.ofDescending(1, 2, 5).roots();
        assertEquals(r.get(0).conjugate(), r.get(1));
    }

    /**
     * The big-grid path must not allocate (DESIGN: hot loops on primitive arrays). Measured with the JVM's
     * per-thread allocation counter, after warm-up, over a 20,000-point grid: a Complex per point would
     * show as about 640 kB, two small scratch arrays per call as about 48 bytes; 0 is expected, and 16 bytes
     * of slack cover the counter's own granularity.
     */
    @Test
    void gridResponseIsAllocationFree() {
        var bean = ManagementFactory.getThreadMXBean();
        assumeTrue(bean instanceof com.sun.management.ThreadMXBean tb && tb.isThreadAllocatedMemorySupported(),
                "per-thread allocation counter not available on this JVM");
        com.sun.management.ThreadMXBean tb = (com.sun.management.ThreadMXBean) bean;
        TransferFunction g = TransferFunction.continuous(new double[] {2, 3, 5}, new double[] {1, 4, 6, 4, 1}).withDelay(1e-3);
        TransferFunction d = Discretization.zoh(g, 1e-3);
        double[] w = RootsAndResponseScipyTest.logGrid(0.1, 3000, 20_000);
        double[] re = new double[w.length], im = new double[w.length];
        for (int k = 0; k < 50; k++) { g.response(w, re, im); d.response(w, re, im); }   // warm up (JIT)
        long id = Thread.currentThread().getId();
        long base0 = tb.getThreadAllocatedBytes(id);
        long base1 = tb.getThreadAllocatedBytes(id);       // cost of the counter call itself
        g.response(w, re, im);
        d.response(w, re, im);
        long after = tb.getThreadAllocatedBytes(id);
        long used = after - base1 - (base1 - base0);
        assertTrue(used <= 16, "grid response allocated " + used + " bytes");
    }
}
