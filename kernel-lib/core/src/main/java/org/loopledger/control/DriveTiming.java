package org.loopledger.control;

import org.loopledger.frf.Frf;
import org.loopledger.lti.TransferFunction;
import org.loopledger.lti.Units;

import java.util.Objects;
import java.util.OptionalDouble;

/**
 * The digital drive's effects on a loop: sample rate, computation delay, zero-order hold on the output,
 * and the closed current loop as a first-order lag. Their product D(jω) ({@link #multiplyFactor}) is
 * included in every loop gain computed by {@link Cascade}:
 * <pre>
 *   D(jω) = e^(-jωτ_c) · H_{zoh}(jω) · ω_{cl}/(jω + ω_{cl}),
 *   τ_c = (computation delay in samples)·T,
 *   H_{zoh}(jω) = e^(-jωT/2) · sin(ωT/2)/(ωT/2).
 * </pre>
 * <ul>
 *   <li><b>Computation delay</b>: exact as e<sup>-jωτ</sup> for any fraction of a sample (a delay is exact only in
 *       the frequency domain; it is never replaced by a Padé approximant here).</li>
 *   <li><b>Zero-order hold</b>: (1 - e<sup>-sT</sup>)/(sT), the hold's own response including the sampler's 1/T. This is
 *       the <em>continuous-domain</em> treatment: it keeps the fundamental and neglects aliasing, which is accurate when
 *       the plant output is small above the Nyquist frequency (the usual case for a servo plant that rolls off), and it
 *       is the only treatment available for a measured plant {@link Frf}. For a model plant the exact alternative is to
 *       discretise it with {@code Discretization.zoh}, which contains the hold, and then not to apply this factor:
 *       {@link Cascade#models()} does that (exact at the sample instants).</li>
 *   <li><b>Current loop</b>: optional first-order lag with bandwidth ω<sub>cl</sub> (Hz at the boundary) between the
 *       current command and the current, when the plant data start at the current rather than at the command.</li>
 * </ul>
 * <p>Do not count an effect twice: a plant {@code Frf} measured from the drive's own current command to its own
 * velocity estimate already contains the hold, the delays and the current loop. Then use a sampled timing with
 * {@code withZeroOrderHold(false)}, delay 0 and no current lag, so that only the controller is made discrete.
 *
 * <p><b>A model plant without a hold</b> (a model from physics, the "truth" of a synthetic study, or a fit made with
 * {@code FitOptions.sampledAt}) describes the mechanics only: keep the hold on (the default of {@link #sampledAtHz})
 * and state the computation delay and current loop, so that the loop gain contains what the drive adds. Turning the
 * hold off for such a model drops half a sample of lag and makes the margins optimistic.
 *
 * <p><b>A fitted model with a delay.</b> The delay τ of {@code FitOptions.withDelay()} absorbs every lag the model
 * does not explain. Use it either in the model or in the timing, never in both. To move it into the timing (as
 * {@code ServoSimulation}, which refuses a plant with a delay and always holds the output, requires), take the
 * model {@code withoutDelay()} and a computation delay of
 * <ul>
 *   <li>τ·f<sub>s</sub> - 0.5 samples for a continuous fit ({@code sampleTimeS = 0}) of data measured from the
 *       drive's held current command to its sampled velocity: the hold's phase is exactly -ωT/2 below f<sub>s</sub>,
 *       so such a fit finds τ ≈ τ<sub>c</sub> + T/2, and the hold is added back by the timing;</li>
 *   <li>τ·f<sub>s</sub> samples for a fit with {@code FitOptions.sampledAt(T)}, which explains the hold itself.</li>
 * </ul>
 * Give no current-loop lag when the data started at the current command (the lag is then inside τ and the model).
 * Checked on a two-mass plant at 8 kHz with one sample of computation delay ({@code FittedDelayTimingTest}): the
 * continuous fit finds 1.502 samples, the sampled-data fit 1.000; a position step simulated with the recipe differs
 * from the true plant's by 6.5·10<sup>-4</sup> of the step (continuous fit, whose J, b and ζ also bend around
 * the hold's magnitude droop) and 10<sup>-15</sup> (sampled-data fit); counting the hold twice gives 1.6·10<sup>-3</sup>.
 *
 * <p>With a sample rate, {@link Cascade} evaluates the controller and filters in their discrete forms at
 * z = e<sup>jωT</sup>, so the frequency grid must end at or below the Nyquist frequency. Immutable.
 */
public final class DriveTiming {
    private static final DriveTiming CONTINUOUS = new DriveTiming(false, Double.NaN, 0, false, Double.POSITIVE_INFINITY);

    private final boolean sampled;
    private final double sampleRateHz;
    private final double delaySamples;
    private final boolean zoh;
    private final double currentLoopRadPerS;

    private DriveTiming(boolean sampled, double sampleRateHz, double delaySamples, boolean zoh, double currentLoopRadPerS) {
        this.sampled = sampled;
        this.sampleRateHz = sampleRateHz;
        this.delaySamples = delaySamples;
        this.zoh = zoh;
        this.currentLoopRadPerS = currentLoopRadPerS;
    }

    /** No sampling, no delay, no hold, ideal current loop: the controller is evaluated in continuous time. */
    public static DriveTiming continuous() { return CONTINUOUS; }

    /**
     * A drive sampling at {@code sampleRateHz} (e.g. 16000): zero-order hold on, computation delay 0 samples,
     * ideal current loop. Set the rest with the {@code with...} methods.
     */
    public static DriveTiming sampledAtHz(double sampleRateHz) {
        if (!(sampleRateHz > 0) || Double.isInfinite(sampleRateHz)) {
            throw new IllegalArgumentException("drive sample rate must be a finite positive number of Hz (e.g. 16000), got " + sampleRateHz);
        }
        if (sampleRateHz < 1 || sampleRateHz > 1e8) {
            throw new IllegalArgumentException("drive sample rate " + Units.formatHz(sampleRateHz)
                    + " is outside 1 Hz .. 100 MHz; servo drives sample at a few kHz to a few hundred kHz. Check the unit (Hz, not kHz or s)");
        }
        return new DriveTiming(true, sampleRateHz, 0, true, Double.POSITIVE_INFINITY);
    }

    /** Computation delay as a number of samples (0 to 10; 1 = output at the next sample, 0.5 = mid-sample). */
    public DriveTiming withComputationDelaySamples(double samples) {
        requireSampled("a computation delay");
        if (!(samples >= 0) || samples > 10) {
            throw new IllegalArgumentException("computation delay must lie in 0 .. 10 samples, got " + samples
                    + "; give it in samples (e.g. 1.0 or 0.5), not in seconds");
        }
        return new DriveTiming(true, sampleRateHz, samples, zoh, currentLoopRadPerS);
    }

    public DriveTiming withZeroOrderHold(boolean on) {
        requireSampled("a zero-order hold");
        return new DriveTiming(true, sampleRateHz, delaySamples, on, currentLoopRadPerS);
    }

    /** The closed current loop as ω<sub>cl</sub>/(s + ω<sub>cl</sub>), bandwidth in Hz. */
    public DriveTiming withCurrentLoopBandwidthHz(double bandwidthHz) {
        if (!(bandwidthHz > 0) || Double.isInfinite(bandwidthHz)) {
            throw new IllegalArgumentException("current-loop bandwidth must be a finite positive number of Hz, got " + bandwidthHz
                    + "; use withoutCurrentLoopLag() for an ideal current loop");
        }
        return new DriveTiming(sampled, sampleRateHz, delaySamples, zoh, Units.hzToRadPerS(bandwidthHz));
    }

    public DriveTiming withoutCurrentLoopLag() { return new DriveTiming(sampled, sampleRateHz, delaySamples, zoh, Double.POSITIVE_INFINITY); }

    private void requireSampled(String what) {
        if (!sampled) throw new IllegalArgumentException(what + " needs a sample rate; start from DriveTiming.sampledAtHz(rate)");
    }

    public boolean isSampled() { return sampled; }

    /** Sample rate in Hz; throws for a continuous timing. */
    public double sampleRateHz() {
        requireSampled("the sample rate");
        return sampleRateHz;
    }

    public double sampleTimeS() { return 1.0 / sampleRateHz(); }

    /** π·fs in rad/s; +∞ for a continuous timing. */
    public double nyquistRadPerS() { return sampled ? Math.PI * sampleRateHz : Double.POSITIVE_INFINITY; }

    public double computationDelaySamples() { return delaySamples; }

    /** τ<sub>c</sub> in s (0 for a continuous timing). */
    public double computationDelayS() { return sampled ? delaySamples / sampleRateHz : 0; }

    public boolean hasZeroOrderHold() { return zoh; }

    public OptionalDouble currentLoopBandwidthHz() {
        return Double.isInfinite(currentLoopRadPerS) ? OptionalDouble.empty() : OptionalDouble.of(Units.radPerSToHz(currentLoopRadPerS));
    }

    /** The current loop ω<sub>cl</sub>/(s + ω<sub>cl</sub>), or 1 when ideal. */
    public TransferFunction currentLoop() {
        if (Double.isInfinite(currentLoopRadPerS)) return TransferFunction.gain(1.0);
        return TransferFunction.continuous(new double[] {currentLoopRadPerS}, new double[] {1, currentLoopRadPerS});
    }

    /** Whether D is rational (no delay, no hold), so loops can be written as transfer functions. */
    public boolean isRational() { return computationDelayS() == 0 && !zoh; }

    /** Throws unless every ω is at or below the Nyquist frequency (for a sampled timing). */
    public void requireWithinNyquist(double[] omegaRadPerS) {
        if (!sampled) return;
        double top = omegaRadPerS[omegaRadPerS.length - 1];
        if (top > nyquistRadPerS() * (1 + 1e-12)) {
            throw new IllegalArgumentException("the frequency grid reaches " + Units.formatHz(Units.radPerSToHz(top)) + ", above the Nyquist frequency "
                    + Units.formatHz(sampleRateHz / 2) + " of the drive; a sampled loop is defined only up to Nyquist. Restrict the plant data "
                    + "(Frf.restrictedToHz(lo, " + Units.g4(sampleRateHz / 2) + "))");
        }
    }

    /** (re + j·im) ← (re + j·im)·D(jω) on {@code omegaRadPerS} (not modified); allocation-free. */
    public void multiplyFactor(double[] omegaRadPerS, double[] re, double[] im) {
        double tau = computationDelayS() + (zoh ? 0.5 / sampleRateHz : 0);
        double halfT = zoh ? 0.5 / sampleRateHz : 0;
        boolean lag = !Double.isInfinite(currentLoopRadPerS);
        for (int i = 0; i < omegaRadPerS.length; i++) {
            double w = omegaRadPerS[i];
            double fr = 1, fi = 0;
            if (tau > 0) {
                fr = Math.cos(w * tau);
                fi = -Math.sin(w * tau);
            }
            if (zoh) {
                double x = w * halfT;
                double sinc = x == 0 ? 1 : Math.sin(x) / x;
                fr *= sinc;
                fi *= sinc;
            }
            if (lag) { // ωcl/(jω + ωcl) = ωcl(ωcl - jω)/(ωcl² + ω²)
                double d = currentLoopRadPerS * currentLoopRadPerS + w * w;
                double lr = currentLoopRadPerS * currentLoopRadPerS / d, li = -currentLoopRadPerS * w / d;
                double t = fr * lr - fi * li;
                fi = fr * li + fi * lr;
                fr = t;
            }
            double r = re[i] * fr - im[i] * fi;
            im[i] = re[i] * fi + im[i] * fr;
            re[i] = r;
        }
    }

    /** D(jω) on a grid as an {@code Frf}. */
    public Frf factor(double[] omegaRadPerS) {
        double[] re = ComplexArrays.ones(omegaRadPerS.length), im = new double[omegaRadPerS.length];
        multiplyFactor(omegaRadPerS, re, im);
        return Frf.ofParts(omegaRadPerS, re, im).asComputedFromModel();
    }

    @Override public boolean equals(Object o) {
        return o instanceof DriveTiming d && d.sampled == sampled && (!sampled || d.sampleRateHz == sampleRateHz) && d.delaySamples == delaySamples
                && d.zoh == zoh && d.currentLoopRadPerS == currentLoopRadPerS;
    }

    @Override public int hashCode() { return Objects.hash(sampled, sampled ? sampleRateHz : 0, delaySamples, zoh, currentLoopRadPerS); }

    @Override public String toString() {
        String cl = Double.isInfinite(currentLoopRadPerS) ? "ideal current loop" : "current loop " + Units.formatRadPerSAsHz(currentLoopRadPerS);
        if (!sampled) return "continuous drive (no sampling, no delay), " + cl;
        return "drive at " + Units.formatHz(sampleRateHz) + ", computation delay " + Units.g4(delaySamples) + " samples ("
                + Units.g4(computationDelayS() * 1e6) + " µs), " + (zoh ? "zero-order hold" : "no hold") + ", " + cl;
    }
}
