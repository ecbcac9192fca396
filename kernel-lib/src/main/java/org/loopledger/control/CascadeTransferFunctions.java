package org.loopledger.control;

import org.loopledger.lti.Discretization;
import org.loopledger.lti.TimeBase;
import org.loopledger.lti.TransferFunction;
import org.loopledger.lti.Units;

import java.util.Objects;

/**
 * The break-point loop gains and closed loops of a PIV cascade as transfer functions (definitions in
 * {@link CascadeLoops}). Products are not reduced: common factors are kept rather than cancelled numerically.
 */
public record CascadeTransferFunctions(TransferFunction plantInput, TransferFunction velocityLoop, TransferFunction positionLoop,
                                       TransferFunction velocityClosedLoop, TransferFunction positionClosedLoop) {
    public CascadeTransferFunctions {
        Objects.requireNonNull(plantInput, "plantInput");
        Objects.requireNonNull(velocityLoop, "velocityLoop");
        Objects.requireNonNull(positionLoop, "positionLoop");
        Objects.requireNonNull(velocityClosedLoop, "velocityClosedLoop");
        Objects.requireNonNull(positionClosedLoop, "positionClosedLoop");
    }

    /**
     * Continuous loops: L<sub>v</sub> = C<sub>v</sub>(s)·F(s)·G<sub>cl</sub>(s)·P<sub>v</sub>(s), L<sub>u</sub> = L<sub>v</sub>(s + K<sub>p</sub>)/s,
     * T<sub>v</sub> = L<sub>v</sub>/(1 + L<sub>v</sub>), L<sub>p</sub> = K<sub>p</sub>T<sub>v</sub>/s, T<sub>p</sub> = L<sub>p</sub>/(1 + L<sub>p</sub>).
     * Needs a continuous timing (a current-loop lag is allowed) and a plant without delay.
     */
    public static CascadeTransferFunctions continuous(TransferFunction plantToVelocity, Piv piv, FilterChain filters, DriveTiming timing) {
        if (timing.isSampled()) {
            throw new IllegalArgumentException("a sampled drive has no continuous rational loop; use CascadeTransferFunctions.sampled or the Frf loops of CascadeLoops");
        }
        if (plantToVelocity.isDiscrete() || plantToVelocity.hasDelay()) {
            throw new IllegalArgumentException("continuous loop transfer functions need a continuous plant without delay, got " + plantToVelocity
                    + "; use the Frf loops of CascadeLoops, where delays are exact");
        }
        TransferFunction lv = piv.velocity().continuous().times(filters.continuous()).times(timing.currentLoop()).times(plantToVelocity);
        double kp = piv.positionGainPerS();
        TransferFunction integrator = TransferFunction.continuous(new double[] {1}, new double[] {1, 0});
        TransferFunction tv = lv.feedback();
        TransferFunction lp = tv.times(integrator).times(kp);
        TransferFunction lu = lv.times(TransferFunction.continuous(new double[] {1, kp}, new double[] {1, 0}));
        return new CascadeTransferFunctions(lu, lv, lp, tv, lp.feedback());
    }

    /**
     * The exact sampled-data loops at the drive's sample instants. The plant (with the current-loop lag) is
     * replaced by its zero-order-hold equivalents P<sub>v</sub>(z) = ZOH{G<sub>cl</sub>P<sub>v</sub>} and
     * P<sub>x</sub>(z) = ZOH{G<sub>cl</sub>P<sub>v</sub>/s} ({@link Discretization#zoh}, which contains the hold, so the
     * hold is always modelled here whatever {@link DriveTiming#hasZeroOrderHold()} says), and the computation delay
     * of m whole samples is z<sup>-m</sup>. With C(z) = C<sub>v</sub>(z)F(z)z<sup>-m</sup>:
     * L<sub>v</sub> = C·P<sub>v</sub>(z), L<sub>u</sub> = C·(K<sub>p</sub>P<sub>x</sub>(z) + P<sub>v</sub>(z)),
     * L<sub>p</sub> = K<sub>p</sub>P<sub>x</sub>(z)·C/(1 + L<sub>v</sub>).
     *
     * @throws IllegalArgumentException for a computation delay that is not a whole number of samples (its exact
     *         sampled model needs the modified z-transform; use the Frf loops, where the delay is exact)
     */
    public static CascadeTransferFunctions sampled(TransferFunction plantToVelocity, Piv piv, FilterChain filters, DriveTiming timing) {
        if (!timing.isSampled()) throw new IllegalArgumentException("sampled loops need a sampled DriveTiming (DriveTiming.sampledAtHz)");
        if (plantToVelocity.isDiscrete() || plantToVelocity.hasDelay()) {
            throw new IllegalArgumentException("sampled loop transfer functions need a continuous plant without delay, got " + plantToVelocity);
        }
        double m = timing.computationDelaySamples();
        if (Math.abs(m - Math.rint(m)) > 1e-12) {
            throw new IllegalArgumentException("computation delay of " + Units.g4(m) + " samples is not a whole number of samples; its exact sampled "
                    + "model is not a plain z^-m. Use the Frf loops of CascadeLoops (delay exact there) or round the delay");
        }
        double t = timing.sampleTimeS();
        TransferFunction pg = timing.currentLoop().times(plantToVelocity);
        TransferFunction pv = Discretization.zoh(pg, t);
        TransferFunction px = Discretization.zoh(pg.times(TransferFunction.continuous(new double[] {1}, new double[] {1, 0})), t);
        double[] den = new double[(int) Math.rint(m) + 1];
        den[0] = 1;
        TransferFunction delay = TransferFunction.of(org.loopledger.lti.Polynomial.one(), org.loopledger.lti.Polynomial.ofDescending(den), TimeBase.sampled(t));
        TransferFunction c = piv.velocity().discrete(t).times(filters.discrete(timing.sampleRateHz())).times(delay);
        double kp = piv.positionGainPerS();
        TransferFunction lv = c.times(pv);
        TransferFunction lu = c.times(px.times(kp).plus(pv));
        TransferFunction lp = px.times(kp).times(c).times(lv.plus(1.0).inverse());
        return new CascadeTransferFunctions(lu, lv, lp, lv.feedback(), lp.feedback());
    }
}
