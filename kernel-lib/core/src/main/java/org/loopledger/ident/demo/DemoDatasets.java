package org.loopledger.ident.demo;

import org.loopledger.ident.fit.TwoMassParameters;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;

/**
 * Writes the SYNTHETIC demo datasets of the invented laser-marking gantry (axis X, three load cases)
 * and their README to a folder: {@code java ... org.loopledger.ident.demo.DemoDatasets [folder]}
 * (default {@code datasets}). The output is identical on every run and machine (fixed seeds, plain
 * arithmetic; see {@link GantrySimulator}); a test regenerates it in memory and compares SHA-256 with
 * the committed files.
 *
 * <p>CSV columns (header convention of {@link org.loopledger.ident.log.LogColumns}):
 * {@code time_s, current_injected_A, current_measured_A, velocity_rad_s, position_rad}; time with 7
 * decimals (exact at 16 kHz), the other columns with 9 significant digits.
 */
public final class DemoDatasets {
    public static final String HEADER = "time_s,current_injected_A,current_measured_A,velocity_rad_s,position_rad";

    private DemoDatasets() {}

    public static void main(String[] args) throws IOException {
        Path dir = Path.of(args.length > 0 ? args[0] : "datasets");
        writeAll(dir);
        System.out.println("wrote the synthetic gantry and linear-axis datasets and README.md to " + dir.toAbsolutePath());
    }

    public static void writeAll(Path dir) throws IOException {
        Files.createDirectories(dir);
        for (GantryLoadCase c : GantryLoadCase.values()) Files.writeString(dir.resolve(c.fileName()), csv(c), StandardCharsets.UTF_8);
        Files.writeString(dir.resolve(LinearAxisScope.FILE), LinearAxisScope.csv(), StandardCharsets.UTF_8);
        Files.writeString(dir.resolve("README.md"), readme(), StandardCharsets.UTF_8);
    }

    /** The simulated log of one load case. */
    public static GantrySimulator.Record simulate(GantryLoadCase c) {
        return GantrySimulator.simulate(c.axis(), DriveLoopSettings.demo(), c.seed());
    }

    /** The CSV text of one load case. */
    public static String csv(GantryLoadCase c) {
        GantrySimulator.Record r = simulate(c);
        StringBuilder sb = new StringBuilder(r.timeS().length * 80);
        sb.append(HEADER).append('\n');
        for (int k = 0; k < r.timeS().length; k++) {
            sb.append(String.format(Locale.ROOT, "%.7f", r.timeS()[k])).append(',')
                    .append(g9(r.injectedA()[k])).append(',')
                    .append(g9(r.measuredA()[k])).append(',')
                    .append(g9(r.velocityRadPerS()[k])).append(',')
                    .append(g9(r.positionRad()[k])).append('\n');
        }
        return sb.toString();
    }

    private static String g9(double v) { return v == 0 ? "0" : String.format(Locale.ROOT, "%.9g", v); }

    /** The true modal parameters of a load case's current → logged-velocity response (delay = the measurement delay). */
    public static TwoMassParameters truth(GantryLoadCase c) {
        return c.axis().modalTruth(DriveLoopSettings.demo().measurementDelayS());
    }

    /** The first line of {@link #readme()}, by which a README written here is recognised. */
    public static String readmeTitle() { return readme().lines().findFirst().orElseThrow(); }

    public static String readme() {
        DriveLoopSettings s = DriveLoopSettings.demo();
        StringBuilder sb = new StringBuilder();
        sb.append("""
                # Demo datasets: SYNTHETIC laser-marking gantry (axis X) and linear pick-and-place axis (Y)

                **These data are synthetic.** They come from a simulation with invented parameters; no
                machine was measured. They exist to demonstrate and test identification, fitting and
                tuning, with known true parameters to check against.

                Regenerate them (byte for byte identical) with `./loopledger datasets` (or
                `./loopledger datasets FOLDER`); each file is written atomically, and a file of another
                kind is never overwritten. A test compares the SHA-256 of these files with a fresh
                in-memory generation, so they cannot drift from the generator.

                ## Scenario (invented)

                A servo motor drives a ball screw through a compliant coupling: a two-mass system with a
                resonance a few hundred hertz up. The drive runs its velocity loop at 16 kHz; a PRBS is
                injected at the current (torque) command while the loop is closed. Three load cases differ
                in the moving mass: empty carriage, light marking head, heavy marking head.

                ## Columns

                Header convention: `quantity_unit`, unit tokens `s`, `A`, `rad`, `rad_s` (rad/s);
                see `org.loopledger.ident.log.LogColumns`.

                | column | meaning |
                |---|---|
                | `time_s` | sample time, k/16000 s |
                | `current_injected_A` | the injected PRBS (excitation r) |
                | `current_measured_A` | measured motor current (plant input u), with sensor noise |
                | `velocity_rad_s` | measured motor velocity (plant output y), one sample late, with noise |
                | `position_rad` | motor position, one sample late, quantised to the encoder |

                ## Invented parameters

                """);
        sb.append(String.format(Locale.ROOT, """
                | parameter | value |
                |---|---|
                | torque constant Kt | %s N·m/A |
                | motor inertia Jm | %s kg·m² |
                | ball screw inertia | %s kg·m² |
                | screw lead | %s m |
                | coupling + screw stiffness k | %s N·m/rad |
                | coupling damping c | %s N·m·s/rad |
                | motor viscous friction b | %s N·m·s/rad |
                | control rate | %s Hz |
                | velocity PI | Kp = %s A/(rad/s), integral corner %s Hz, feedback low-pass %s Hz |
                | delays | 1 sample computation (current), 1 sample velocity measurement |
                | current limit | ±%s A |
                | excitation | PRBS%d (ITU-T O.150), %d samples per bit, ±%s A, %d periods of %d samples |
                | noise (white, RMS) | torque disturbance %s A, velocity %s rad/s, current %s A; encoder %d counts/rev |

                """, g(GantryLoadCase.TORQUE_CONSTANT_NM_PER_A), g(GantryLoadCase.MOTOR_INERTIA_KG_M2), g(GantryLoadCase.SCREW_INERTIA_KG_M2),
                g(GantryLoadCase.LEAD_M), g(GantryLoadCase.STIFFNESS_NM_PER_RAD), g(GantryLoadCase.DAMPING_NMS_PER_RAD), g(GantryLoadCase.VISCOUS_NMS_PER_RAD),
                g(s.sampleRateHz()), g(s.velocityGainAsPerRad()), g(s.integralCornerHz()), g(s.feedbackFilterHz()), g(s.currentLimitA()),
                s.prbsOrder(), s.prbsSamplesPerBit(), g(s.prbsAmplitudeA()), s.prbsPeriods(), ((1 << s.prbsOrder()) - 1) * s.prbsSamplesPerBit(),
                g(s.torqueNoiseA()), g(s.velocityNoiseRadPerS()), g(s.currentNoiseA()), s.encoderCountsPerRev()));
        sb.append("""
                ## True parameters per load case

                Current → logged velocity is the zero-order-hold sampled form of
                Kt/(J s + b) · (s²/ωa² + 2ζa s/ωa + 1)/(s²/ωr² + 2ζr s/ωr + 1) · e^(-sτ), τ = one sample (62.5 µs).
                J and b here are the exact equivalents of the physical values (J = Jm·ωr²/ωa², close to Jm + Jl).

                | file | moving mass | load inertia Jl | J | b | resonance | ζr | antiresonance | ζa | inertia ratio |
                |---|---|---|---|---|---|---|---|---|---|
                """);
        for (GantryLoadCase c : GantryLoadCase.values()) {
            TwoMassParameters t = truth(c);
            sb.append(String.format(Locale.ROOT, "| `%s` | %s kg | %s kg·m² | %s kg·m² | %s N·m·s/rad | %s Hz | %s | %s Hz | %s | %s |%n",
                    c.fileName(), g(c.movingMassKg()), g(c.axis().loadInertiaKgM2()), g(t.inertiaKgM2()), g(t.viscousNmsPerRad()),
                    g(t.resonanceHz()), g(t.resonanceDamping()), g(t.antiresonanceHz()), g(t.antiresonanceDamping()), g(t.inertiaRatio())));
        }
        sb.append("\n").append(LinearAxisScope.readme());
        sb.append("""
                ## Caution

                Tuning moves real machinery. Try new gains with reduced current and speed limits, guarding and an
                emergency stop in place, per the machine's risk assessment and the machinery-safety standards that
                apply (for example ISO 12100, IEC 60204-1). The figures are engineering aids, not a certification.
                """);
        return sb.toString().replace("\r\n", "\n");
    }

    private static String g(double v) {
        String s = String.format(Locale.ROOT, "%.6g", v);
        if (s.contains("e")) return s;
        if (s.contains(".")) s = s.replaceAll("0+$", "").replaceAll("\\.$", "");
        return s;
    }
}
