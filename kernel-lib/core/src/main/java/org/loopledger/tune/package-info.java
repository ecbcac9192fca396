/**
 * Auto-tune of a PIV cascade: {@link org.loopledger.tune.AutoTune} searches the gains (and, where it pays, a low-pass)
 * on one or more measured plant FRFs ({@link org.loopledger.tune.PlantCase}s, the worst case counts) or on a model,
 * against a {@link org.loopledger.tune.TuningSpec}, and returns a {@link org.loopledger.tune.TuningResult}: the gains,
 * the figures of every load case from an independent re-analysis ({@link org.loopledger.tune.LoadCaseFigures}), the
 * verdict and the binding constraint. {@link org.loopledger.tune.Resonances} finds resonances and antiresonances in
 * measured data; {@link org.loopledger.tune.NotchProposal} proposes a notch and judges it by re-tuning.
 *
 * <p><b>Units.</b> Bandwidth targets and frequencies in Hz, margins in degrees and dB, Ms as a ratio; K<sub>p</sub>
 * in 1/s, K<sub>v</sub> in plant-input units per rad/s (or per m/s on a linear axis).
 *
 * <p>Entry points: {@code AutoTune.onMeasured(cases, timing, filters, spec)},
 * {@code NotchProposal.propose(...)}. Try tuned gains with reduced current and speed limits first.
 */
package org.loopledger.tune;
