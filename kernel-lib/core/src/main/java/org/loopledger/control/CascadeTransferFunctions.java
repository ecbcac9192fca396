package org.loopledger.control;

import org.loopledger.lti.Discretization;
import org.loopledger.lti.Polynomial;
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
     * L<sub>p</sub> = K<sub>p</sub>P<sub>x</sub>(z)·C/(1 + L<sub>v</sub>), written over common polynomials (P<sub>x</sub>'s denominator
     * is P<sub>v</sub>'s times (z - 1)) so that no factor appears twice.
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
        TimeBase tb = TimeBase.sampled(t);
        TransferFunction pg = timing.currentLoop().times(plantToVelocity);
        TransferFunction pv = Discretization.zoh(pg, t);
        TransferFunction px = Discretization.zoh(pg.times(TransferFunction.continuous(new double[] {1}, new double[] {1, 0})), t);
        // P_x has the poles of P_v and one more at z = 1 (the integrator, e^{0·T}); build its denominator as exactly
        // D_v·(z - 1) so that the closed loops below carry no duplicated, numerically uncancelled factors.
        Polynomial zm1 = Polynomial.ofDescending(1, -1);
        Polynomial dv = pv.denominator(), nv = pv.numerator(), dx = dv.times(zm1), nx = px.numerator();
        double[] dxa = dx.coefficientsDescending(), dxb = px.denominator().coefficientsDescending();
        double scale = 0, diff = 0;
        for (int i = 0; i < dxa.length; i++) {
            scale = Math.max(scale, Math.abs(dxa[i]));
            diff = Math.max(diff, Math.abs(dxa[i] - (i < dxb.length ? dxb[i] : 0)));
        }
        if (dxa.length != dxb.length || diff > 1e-9 * scale) {
            throw new IllegalStateException("zero-order-hold equivalents of P and P/s do not share their poles (" + px + " vs " + pv + ")");
        }
        int mi = (int) Math.rint(m);
        double[] zm = new double[mi + 1];
        zm[0] = 1;
        TransferFunction c = piv.velocity().discrete(t).times(filters.discrete(timing.sampleRateHz()))
                .times(TransferFunction.of(Polynomial.one(), Polynomial.ofDescending(zm), tb));
        Polynomial nc = c.numerator(), dc = c.denominator();
        double kp = piv.positionGainPerS();
        Polynomial closedV = dc.times(dv).plus(nc.times(nv));   // (1 + L_v)·D_c·D_v
        Polynomial fwdX = nx.times(nc).times(kp);               // K_p·N_x·N_c
        TransferFunction lv = TransferFunction.of(nc.times(nv), dc.times(dv), tb);
        TransferFunction tv = TransferFunction.of(nc.times(nv), closedV, tb);
        TransferFunction lp = TransferFunction.of(fwdX, zm1.times(closedV), tb);
        TransferFunction tp = TransferFunction.of(fwdX, zm1.times(closedV).plus(fwdX), tb);
        TransferFunction lu = TransferFunction.of(nc.times(nx.times(kp).plus(zm1.times(nv))), dc.times(dv).times(zm1), tb);
        return new CascadeTransferFunctions(lu, lv, lp, tv, tp);
    }
}
