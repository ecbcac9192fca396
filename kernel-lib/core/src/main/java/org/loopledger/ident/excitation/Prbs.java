package org.loopledger.ident.excitation;

import java.util.Locale;

/**
 * Maximum-length pseudo-random binary sequence from an ITU-T O.150 polynomial (see
 * {@link PrbsPolynomial} for the register convention), held for {@code samplesPerBit} samples per bit
 * (the bit-rate divider), scaled to ±amplitude (bit 1 → +amplitude, bit 0 → -amplitude, as SciPy's
 * {@code 2·seq - 1}; O.150's inversion is not applied).
 *
 * <p>The register starts with all stages at 1, as {@code scipy.signal.max_len_seq} does by default.
 * One period is (2<sup>n</sup> - 1)·samplesPerBit samples; its spectrum is flat apart from the DC line
 * and, with a divider N, the hold's sinc envelope with nulls at multiples of fs/N.
 *
 * @param polynomial    the O.150 generator polynomial
 * @param amplitude     level of each bit, in the unit of the injected signal (e.g. A); positive
 * @param samplesPerBit bit-rate divider N ≥ 1: each bit is held N samples
 * @param periods       number of whole periods ≥ 1
 * @param sampleRateHz  the drive's sample rate
 */
public record Prbs(PrbsPolynomial polynomial, double amplitude, int samplesPerBit, int periods, double sampleRateHz) {
    /** Longest sequence generated as an array (2^27 - 1 bits would already be 128 MB of doubles at N = 1). */
    public static final int MAX_ARRAY_ORDER = 26;

    public Prbs {
        if (polynomial == null) throw new IllegalArgumentException("PRBS polynomial missing; use PrbsPolynomial.ofOrder(n)");
        if (!(amplitude > 0) || Double.isInfinite(amplitude)) throw new IllegalArgumentException("PRBS amplitude must be finite and positive, got " + amplitude);
        if (samplesPerBit < 1) throw new IllegalArgumentException("bit-rate divider (samples per bit) must be at least 1, got " + samplesPerBit);
        if (periods < 1) throw new IllegalArgumentException("PRBS periods must be at least 1, got " + periods);
        ExcitationSignal.requireRate(sampleRateHz);
    }

    /** Convenience: order n looked up in the O.150 table. */
    public static Prbs of(int order, double amplitude, int samplesPerBit, int periods, double sampleRateHz) {
        return new Prbs(PrbsPolynomial.ofOrder(order), amplitude, samplesPerBit, periods, sampleRateHz);
    }

    /**
     * One period of the bit sequence (0 or 1), 2<sup>n</sup> - 1 bits, from the all-ones state:
     * b[t] = b[t-m] XOR b[t-n], with b[-1] .. b[-n] = 1, output b[t-n] (the last stage), so the first n
     * output bits are the initial ones.
     */
    public static byte[] bits(PrbsPolynomial p) {
        if (p.order() > MAX_ARRAY_ORDER) {
            throw new IllegalArgumentException("PRBS order " + p.order() + " has " + p.period() + " bits per period, too long to hold in memory; "
                    + "use an order up to " + MAX_ARRAY_ORDER + " or bits(polynomial, count) for a prefix");
        }
        return bits(p, (int) p.period());
    }

    /** The first {@code count} output bits of the register (any order; the sequence repeats after 2<sup>n</sup> - 1). */
    public static byte[] bits(PrbsPolynomial p, int count) {
        if (count < 0) throw new IllegalArgumentException("bit count must be non-negative, got " + count);
        int n = p.order(), m = p.middleExponent();
        long mask = (1L << n) - 1;
        byte[] out = new byte[count];
        // register bit k-1 holds stage k, and stage k holds b[t-k]
        long reg = mask;
        for (int t = 0; t < count; t++) {
            long fb = ((reg >>> (m - 1)) ^ (reg >>> (n - 1))) & 1L;
            out[t] = (byte) ((reg >>> (n - 1)) & 1L);
            reg = ((reg << 1) | fb) & mask;
        }
        return out;
    }

    /**
     * Steps the register from the all-ones state until it returns to it and gives the number of steps:
     * 2<sup>n</sup> - 1 for a maximum-length polynomial. Costs 2<sup>n</sup> steps.
     */
    public static long registerPeriod(PrbsPolynomial p) {
        int n = p.order(), m = p.middleExponent();
        long mask = (1L << n) - 1, reg = mask, steps = 0;
        do {
            long fb = ((reg >>> (m - 1)) ^ (reg >>> (n - 1))) & 1L;
            reg = ((reg << 1) | fb) & mask;
            steps++;
        } while (reg != mask && steps <= mask + 1);
        return steps;
    }

    public int periodSamples() { return (int) Math.min(Integer.MAX_VALUE, polynomial.period() * samplesPerBit); }

    /** The excitation: ±amplitude, each bit held {@code samplesPerBit} samples. */
    public ExcitationSignal signal() {
        long len = polynomial.period() * samplesPerBit;
        if (len * periods > Integer.MAX_VALUE - 8) {
            throw new IllegalArgumentException("PRBS of order " + polynomial.order() + " with divider " + samplesPerBit + " and " + periods
                    + " periods has " + len * periods + " samples, more than an array holds; use a lower order or fewer periods");
        }
        byte[] b = bits(polynomial);
        double[] one = new double[(int) len];
        for (int i = 0; i < b.length; i++) {
            double v = b[i] == 1 ? amplitude : -amplitude;
            for (int j = 0; j < samplesPerBit; j++) one[i * samplesPerBit + j] = v;
        }
        return ExcitationSignal.ofPeriod(toString(), sampleRateHz, one, periods);
    }

    /** First null of the held sequence's spectrum, fs/N. */
    public double firstNullHz() { return sampleRateHz / samplesPerBit; }

    @Override public String toString() {
        return String.format(Locale.ROOT, "PRBS%d (x^%d + x^%d + 1), ±%.4g, %d sample(s) per bit at %.6g Hz, %d period(s)",
                polynomial.order(), polynomial.order(), polynomial.middleExponent(), amplitude, samplesPerBit, sampleRateHz, periods);
    }
}
