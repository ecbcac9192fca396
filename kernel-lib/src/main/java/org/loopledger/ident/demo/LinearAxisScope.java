package org.loopledger.ident.demo;

import java.util.Locale;
import java.util.Random;

/**
 * The second SYNTHETIC demo dataset: the invented linear Y axis of {@link LinearAxis}, logged the way a
 * drive's oscilloscope export looks: semicolon-separated with decimal commas, a {@code #} metadata header
 * (with the sample rate), position in encoder counts, velocity in mm/s, currents in mA, and no time column.
 *
 * <p>The drive runs a velocity PI at 8 kHz (one sample of computation delay, one of measurement delay, a
 * first-order feedback low-pass) and injects an odd multisine with Schroeder phases at the current command:
 * odd harmonics of 2 Hz from 2 to 998 Hz, one period 4000 samples (0.5 s), 5 periods; the first period is
 * the transient, so whole periods 2 to 5 are steady state. Deterministic: mechanics by exact zero-order-hold
 * discretisation ({@link GantrySimulator#expm}, plain arithmetic), the multisine with {@link StrictMath},
 * noise from {@link Random} with a fixed seed, numbers printed with fixed decimals.
 */
public final class LinearAxisScope {
    public static final String FILE = "linear-y-scope.csv";
    public static final double SAMPLE_RATE_HZ = 8000;
    public static final int PERIOD_SAMPLES = 4000;
    public static final int PERIODS = 5;
    public static final double BASE_HZ = SAMPLE_RATE_HZ / PERIOD_SAMPLES;
    public static final int HIGHEST_HARMONIC = 499;
    public static final double MULTISINE_RMS_A = 1.2;
    public static final double COUNTS_PER_METRE = 1e7;
    public static final double VELOCITY_GAIN_A_PER_M_S = 36;
    public static final double INTEGRAL_CORNER_HZ = 8;
    public static final double FEEDBACK_FILTER_HZ = 800;
    public static final double CURRENT_LIMIT_A = 8;
    public static final double FORCE_NOISE_A = 0.02, VELOCITY_NOISE_M_S = 5e-4, CURRENT_NOISE_A = 0.01;
    public static final long SEED = 20_261_202L;
    public static final String HEADER = "Pos act [inc];Vel act [mm/s];Iq act [mA];Iq inj [mA]";

    private LinearAxisScope() {}

    /** The simulated channels in SI (position quantised to the encoder, injected current to 0.1 mA as logged). */
    public record Record(double[] positionM, double[] velocityMPerS, double[] measuredA, double[] injectedA) {}

    /** One period of the odd multisine, RMS {@link #MULTISINE_RMS_A}, Schroeder phases over the lines, quantised to 0.1 mA. */
    public static double[] multisinePeriod() {
        int lines = (HIGHEST_HARMONIC + 1) / 2;
        double[] x = new double[PERIOD_SAMPLES];
        for (int l = 0; l < lines; l++) {
            int h = 2 * l + 1;
            // Schroeder (1970) phases for equal amplitudes: φ_l = -π l (l + 1) / L
            double phi = -Math.PI * l * (l + 1.0) / lines;
            for (int n = 0; n < PERIOD_SAMPLES; n++) {
                long arg = ((long) h * n) % PERIOD_SAMPLES;
                x[n] += StrictMath.cos(2 * Math.PI * arg / PERIOD_SAMPLES + phi);
            }
        }
        // each line has amplitude a: RMS = a·sqrt(L/2)
        double a = MULTISINE_RMS_A / StrictMath.sqrt(lines / 2.0);
        for (int n = 0; n < PERIOD_SAMPLES; n++) x[n] = Math.rint(x[n] * a * 1e4) / 1e4;
        return x;
    }

    public static Record simulate() {
        LinearAxis ax = LinearAxis.demo();
        double t = 1 / SAMPLE_RATE_HZ;
        double m1 = ax.carriageMassKg(), m2 = ax.headMassKg(), k = ax.stiffnessNPerM(), c = ax.dampingNsPerM(), b = ax.viscousNsPerM();
        double[][] a = {
                {0, 1, 0, 0},
                {-k / m1, -(b + c) / m1, k / m1, c / m1},
                {0, 0, 0, 1},
                {k / m2, c / m2, -k / m2, -c / m2}};
        double[] bIn = {0, ax.forceConstantNPerA() / m1, 0, 0};
        double[][] m = new double[5][5];
        for (int i = 0; i < 4; i++) {
            for (int j = 0; j < 4; j++) m[i][j] = a[i][j] * t;
            m[i][4] = bIn[i] * t;
        }
        double[][] phi = GantrySimulator.expm(m);
        double[] period = multisinePeriod();
        int n = PERIOD_SAMPLES * PERIODS;
        double[] pos = new double[n], vel = new double[n], im = new double[n], inj = new double[n];
        Random rnd = new Random(SEED);
        double alpha = StrictMath.exp(-2 * Math.PI * FEEDBACK_FILTER_HZ * t);
        double kp = VELOCITY_GAIN_A_PER_M_S, ki = kp * 2 * Math.PI * INTEGRAL_CORNER_HZ * t;
        double q = 1 / COUNTS_PER_METRE;
        double[] x = new double[4], xn = new double[4];
        double prevV = 0, prevX = 0, iApplied = 0, vf = 0, integ = 0;
        for (int step = 0; step < n; step++) {
            double nv = rnd.nextGaussian() * VELOCITY_NOISE_M_S;
            double ni = rnd.nextGaussian() * CURRENT_NOISE_A;
            double d = rnd.nextGaussian() * FORCE_NOISE_A;
            double r = period[step % PERIOD_SAMPLES];
            double v = prevV + nv;
            vel[step] = v;
            pos[step] = Math.floor(prevX / q + 0.5);
            im[step] = iApplied + ni;
            inj[step] = r;
            vf = alpha * vf + (1 - alpha) * v;
            double e = -vf;
            integ += ki * e;
            double cmd = kp * e + integ + r;
            if (cmd > CURRENT_LIMIT_A) cmd = CURRENT_LIMIT_A;
            if (cmd < -CURRENT_LIMIT_A) cmd = -CURRENT_LIMIT_A;
            double u = iApplied + d;
            prevV = x[1];
            prevX = x[0];
            for (int i = 0; i < 4; i++) {
                double acc = phi[i][4] * u;
                for (int j = 0; j < 4; j++) acc += phi[i][j] * x[j];
                xn[i] = acc;
            }
            System.arraycopy(xn, 0, x, 0, 4);
            iApplied = cmd;
        }
        for (int i = 0; i < n; i++) pos[i] *= q;
        return new Record(pos, vel, im, inj);
    }

    /** The scope-export text (UTF-8, '\n' line ends). */
    public static String csv() {
        Record r = simulate();
        int n = r.positionM().length;
        StringBuilder sb = new StringBuilder(n * 40);
        sb.append("# SYNTHETIC demo data: invented linear axis, generated by org.loopledger.ident.demo.LinearAxisScope; no machine was measured\n")
                .append("# axis = pick-and-place Y, iron-core linear motor\n")
                .append("# sample_rate_Hz = 8000\n")
                .append("# encoder_counts_per_m = 10000000\n")
                .append(String.format(Locale.ROOT, "# excitation = odd multisine at the current command, harmonics 1, 3, ..., %d of %s Hz, %d periods of %d samples%n",
                        HIGHEST_HARMONIC, g(BASE_HZ), PERIODS, PERIOD_SAMPLES))
                .append("# channels = actual position, actual velocity, actual current, injected current\n")
                .append(HEADER).append('\n');
        for (int i = 0; i < n; i++) {
            sb.append(String.format(Locale.ROOT, "%d", Math.round(r.positionM()[i] * COUNTS_PER_METRE))).append(';')
                    .append(comma(String.format(Locale.ROOT, "%.3f", r.velocityMPerS()[i] * 1e3))).append(';')
                    .append(comma(String.format(Locale.ROOT, "%.1f", r.measuredA()[i] * 1e3))).append(';')
                    .append(comma(String.format(Locale.ROOT, "%.1f", r.injectedA()[i] * 1e3))).append('\n');
        }
        return sb.toString();
    }

    private static String comma(String s) {
        String t = s.replace('.', ',');
        return t.equals("-0,0") ? "0,0" : t.equals("-0,000") ? "0,000" : t;
    }

    /** The true parameters of current → logged carriage velocity (delay: one sample of measurement). */
    public static LinearAxis.Truth truth() { return LinearAxis.demo().truth(1 / SAMPLE_RATE_HZ); }

    static String g(double v) {
        String s = String.format(Locale.ROOT, "%.6g", v);
        if (s.contains("e")) return s;
        if (s.contains(".")) s = s.replaceAll("0+$", "").replaceAll("\\.$", "");
        return s;
    }

    /** The README section of this dataset. */
    public static String readme() {
        LinearAxis ax = LinearAxis.demo();
        LinearAxis.Truth tr = truth();
        return String.format(Locale.ROOT, """
                ## Second dataset: SYNTHETIC linear axis, logged like a scope export

                `%s` (**synthetic**, generated by `org.loopledger.ident.demo.LinearAxisScope`): the Y axis of an
                invented pick-and-place machine, an iron-core linear motor whose carriage carries the placement
                head on a compliant bracket (one structural resonance). The drive closes a velocity PI at 8 kHz and
                injects an odd multisine at the current command. The file looks like a drive's oscilloscope export:
                semicolons, decimal commas, a `#` metadata header that states the sample rate, **no time column**,
                position in encoder counts, velocity in mm/s, currents in mA. Read it with a column map:

                ```java
                ColumnMap map = ColumnMap.of()
                    .column("Pos act [inc]", Quantity.POSITION, LogUnit.countsPerMetre(1e7))
                    .column("Vel act [mm/s]", Quantity.VELOCITY, LogUnit.millimetresPerSecond())
                    .column("Iq act [mA]", Quantity.CURRENT_MEASURED, LogUnit.milliamperes())
                    .column("Iq inj [mA]", Quantity.CURRENT_INJECTED, LogUnit.milliamperes());
                DriveLog log = DriveLogReader.read(Path.of("datasets/%s"), map, LogCheckOptions.defaults());
                ```

                | column | meaning | unit in the file | SI name after reading |
                |---|---|---|---|
                | `Pos act [inc]` | carriage position, one sample late, quantised to the encoder | counts, %s per m | `position_m` |
                | `Vel act [mm/s]` | measured carriage velocity (plant output y), one sample late, with noise | mm/s, 3 decimals | `velocity_m_s` |
                | `Iq act [mA]` | measured motor current (plant input u), with noise | mA, 1 decimal | `current_measured_A` |
                | `Iq inj [mA]` | the injected multisine (excitation r) | mA, 1 decimal | `current_injected_A` |

                | invented parameter | value |
                |---|---|
                | force constant Kf | %s N/A |
                | carriage mass m1 | %s kg |
                | head mass m2 | %s kg |
                | bracket stiffness k | %s N/m |
                | bracket damping c | %s N·s/m |
                | carriage viscous friction b | %s N·s/m |
                | control rate | %s Hz (sample rate stated in the file's metadata) |
                | velocity PI | Kp = %s A/(m/s), integral corner %s Hz, feedback low-pass %s Hz |
                | delays | 1 sample computation (current), 1 sample velocity and position measurement |
                | current limit | ±%s A |
                | excitation | odd multisine, Schroeder phases, harmonics 1, 3, ..., %d of %s Hz (%s to %s Hz), %s A RMS, %d periods of %d samples (first period: transient) |
                | noise (white, RMS) | force disturbance %s A, velocity %s m/s, current %s A |

                True parameters of current → logged velocity: the zero-order-hold sampled form of
                Kf/(m s + b')·(s²/ωa² + 2ζa s/ωa + 1)/(s²/ωr² + 2ζr s/ωr + 1)·e^(-sτ), τ = one sample (125 µs):

                | Kf | m | b' | resonance | ζr | antiresonance | ζa |
                |---|---|---|---|---|---|---|
                | %s N/A | %s kg | %s N·s/m | %s Hz | %s | %s Hz | %s |

                """, FILE, FILE, g(COUNTS_PER_METRE), g(ax.forceConstantNPerA()), g(ax.carriageMassKg()), g(ax.headMassKg()), g(ax.stiffnessNPerM()),
                g(ax.dampingNsPerM()), g(ax.viscousNsPerM()), g(SAMPLE_RATE_HZ), g(VELOCITY_GAIN_A_PER_M_S), g(INTEGRAL_CORNER_HZ), g(FEEDBACK_FILTER_HZ),
                g(CURRENT_LIMIT_A), HIGHEST_HARMONIC, g(BASE_HZ), g(BASE_HZ), g(BASE_HZ * HIGHEST_HARMONIC), g(MULTISINE_RMS_A), PERIODS, PERIOD_SAMPLES,
                g(FORCE_NOISE_A), g(VELOCITY_NOISE_M_S), g(CURRENT_NOISE_A),
                g(tr.forceConstantNPerA()), g(tr.massKg()), g(tr.viscousNsPerM()), g(tr.resonanceHz()), g(tr.resonanceDamping()), g(tr.antiresonanceHz()),
                g(tr.antiresonanceDamping()));
    }
}
