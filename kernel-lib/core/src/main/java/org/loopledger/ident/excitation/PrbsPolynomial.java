package org.loopledger.ident.excitation;

import java.util.Arrays;
import java.util.stream.Collectors;

/**
 * The maximum-length PRBS generator polynomials of ITU-T Recommendation O.150 (10/1992, section 5,
 * "Digital test patterns"; the 2<sup>7</sup>-1 pattern from its later amendments), each a trinomial
 * x<sup>n</sup> + x<sup>m</sup> + 1.
 *
 * <p><b>Register convention (O.150).</b> An n-stage shift register; the outputs of stage m and stage n
 * are added modulo two and fed back into stage 1. With b[t] the bit entering stage 1 at step t, stage k
 * holds b[t-k], so the sequence obeys the recurrence
 * <pre>  b[t] = b[t-m] XOR b[t-n].</pre>
 * Read with x as a one-step delay, x<sup>n</sup> + x<sup>m</sup> + 1 is exactly this recurrence.
 *
 * <p><b>SciPy's convention.</b> {@code scipy.signal.max_len_seq(n, taps=[k])} computes
 * a[t+n] = a[t] XOR a[t+k], i.e. a[t] = a[t-n] XOR a[t-n+k]; the same recurrence as ours when k = n - m.
 * SciPy's default taps for order n are the reciprocal polynomial (k = m) for most orders, which gives the
 * time-reversed sequence; for n = 20 both coincide (k = 17, m = 3).
 *
 * <p>O.150 transmits some patterns inverted (orders 15, 23, 29, 31, from memory of the recommendation);
 * {@link #invertedInO150()} records this, and it only flips the sign of the excitation.
 */
public enum PrbsPolynomial {
    PRBS7(7, 6, false),
    PRBS9(9, 5, false),
    PRBS11(11, 9, false),
    PRBS15(15, 14, true),
    PRBS20(20, 3, false),
    PRBS23(23, 18, true),
    PRBS29(29, 27, true),
    PRBS31(31, 28, true);

    private final int order;
    private final int tap;
    private final boolean inverted;

    PrbsPolynomial(int order, int tap, boolean inverted) {
        this.order = order;
        this.tap = tap;
        this.inverted = inverted;
    }

    /** The polynomial of the given order; throws for orders O.150 does not list. */
    public static PrbsPolynomial ofOrder(int order) {
        for (PrbsPolynomial p : values()) if (p.order == order) return p;
        throw new IllegalArgumentException("no ITU-T O.150 PRBS polynomial of order " + order + "; choose one of "
                + Arrays.stream(values()).map(p -> Integer.toString(p.order)).collect(Collectors.joining(", ")));
    }

    /** n, the register length. */
    public int order() { return order; }

    /** m, the middle exponent: the feedback stage besides stage n. */
    public int middleExponent() { return tap; }

    /** The sequence length 2<sup>n</sup> - 1. */
    public long period() { return (1L << order) - 1; }

    public boolean invertedInO150() { return inverted; }

    @Override public String toString() { return "x^" + order + " + x^" + tap + " + 1 (ITU-T O.150, period " + period() + " bits)"; }
}
