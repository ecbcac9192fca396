package org.loopledger.ident.log;

import com.google.gson.JsonObject;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.loopledger.frf.Frf;
import org.loopledger.testing.PythonOracle;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.*;

/**
 * Each text format, unit and the .mat reader against files written by Debian's numpy / SciPy
 * ({@code numpy.savetxt}, {@code scipy.io.savemat} v5) and the values Python reads back from the same files
 * ({@code numpy.loadtxt}, {@code float()} after replacing the decimal comma, {@code scipy.io.loadmat}).
 * One Python process writes every file of the class.
 */
class LogFormatsVsNumpyTest {
    static final double FS = 16000;
    static final int N = 5000;
    static final LogCheckOptions OPT = LogCheckOptions.defaults().withMinimumSamples(1000);

    @TempDir static Path dir;
    static JsonObject ref;

    static final String SCRIPT = """
            import json, sys, numpy as np, scipy.io
            a = json.load(sys.stdin); d = a['dir']; n = a['n']; fs = a['fs']
            rng = np.random.default_rng(7)
            t = np.arange(n) / fs
            cur = 0.5 * rng.standard_normal(n)
            vel = 3.0 * rng.standard_normal(n)
            M = np.column_stack([t, cur, vel])
            out = {}
            # 1 semicolon, plain header
            np.savetxt(d + '/semi.csv', M, delimiter=';', header='time_s;current_measured_A;velocity_rad_s', comments='', fmt='%.10g')
            out['semi'] = np.loadtxt(d + '/semi.csv', delimiter=';', skiprows=1).T.tolist()
            # 2 tab, numpy's default '# ' header after a metadata line
            np.savetxt(d + '/tab.txt', M, delimiter='\\t', header='drive = demo drive 7\\ntime_s\\tcurrent_measured_A\\tvelocity_rad_s', fmt='%.10g')
            out['tab'] = np.loadtxt(d + '/tab.txt', delimiter='\\t').T.tolist()
            # 3 blanks, UTF-8 with a byte-order mark
            with open(d + '/ws.txt', 'w', encoding='utf-8-sig') as f:
                np.savetxt(f, M, delimiter='  ', header='time_s  current_measured_A  velocity_rad_s', comments='', fmt='%.10g')
            out['ws'] = np.loadtxt(d + '/ws.txt', skiprows=1, encoding='utf-8-sig').T.tolist()
            # 4 scope export: decimal comma, semicolons, metadata, counts, rpm, mm/s, mA, N via volts, no time column
            counts = np.round(20000 * rng.standard_normal(n))
            rpm = 1500 * rng.standard_normal(n)
            mms = 250 * rng.standard_normal(n)
            ma = 800 * rng.standard_normal(n)
            volts = 2 * rng.standard_normal(n)
            rows = ['# scope export', '# sample_rate_Hz = 8000', '# axis = Y', 'Pos[inc];Vel[rpm];V[mm/s];Iq[mA];F[V]']
            cells = []
            for r in zip(counts, rpm, mms, ma, volts):
                txt = [('%.0f' % r[0])] + [('%.7g' % v).replace('.', ',') for v in r[1:]]
                cells.append([float(x.replace(',', '.')) for x in txt])
                rows.append(';'.join(txt))
            with open(d + '/scope.csv', 'w') as f: f.write('\\n'.join(rows) + '\\n')
            c = np.array(cells)
            out['scope_si'] = [(c[:, 0] / 4000.0).tolist(), (c[:, 1] * 2 * np.pi / 60).tolist(), (c[:, 2] * 1e-3).tolist(),
                               (c[:, 3] * 1e-3).tolist(), (c[:, 4] * 125.0).tolist()]
            # 5 Latin-1 metadata
            with open(d + '/latin1.csv', 'w', encoding='latin-1') as f:
                f.write('time_s,velocity_rad_s\\n# operator = M\\u00fcller\\n')
                for k in range(n): f.write('%.7f,%.6g\\n' % (t[k], vel[k]))
            # 6 timestamps printed to 1 us and 10 us at 16 kHz
            np.savetxt(d + '/q1us.csv', M, delimiter=',', header='time_s,current_measured_A,velocity_rad_s', comments='', fmt=['%.6f', '%.9g', '%.9g'])
            np.savetxt(d + '/q10us.csv', M, delimiter=',', header='time_s,current_measured_A,velocity_rad_s', comments='', fmt=['%.5f', '%.9g', '%.9g'])
            out['q1us_median_rate'] = float(1 / np.median(np.diff(np.loadtxt(d + '/q1us.csv', delimiter=',', skiprows=1)[:, 0])))
            # 7 time in ms under a time_s header
            Mms = np.column_stack([t * 1000, cur, vel])
            np.savetxt(d + '/ms.csv', Mms, delimiter=',', header='time_s,current_measured_A,velocity_rad_s', comments='', fmt='%.9g')
            # 8 Level 5 .mat file: vectors (row vectors, savemat's default) and, compressed, a struct of channels in lab units
            scipy.io.savemat(d + '/vec.mat', {'time_s': t, 'current_measured_A': cur, 'velocity_rad_s': vel.reshape(-1, 1), 'note': 'bench run 3'}, format='5')
            scipy.io.savemat(d + '/struct.mat', {'scope': {'iq_mA': 1000 * cur, 'v_rpm': vel * 60 / (2 * np.pi)}, 'sample_rate_Hz': 16000.0},
                             format='5', do_compression=True)
            # 9 Level 5 .mat file of other stored types (float32, int16, int32 channels, saved as columns) and a cell array
            scipy.io.savemat(d + '/types.mat', {'time_s': t.astype(np.float32), 'current_measured_A': np.round(cur * 1000).astype(np.int16),
                             'velocity_rad_s': np.round(vel * 100).astype(np.int32), 'tags': np.array(['a', 'bc'], dtype=object)},
                             format='5', oned_as='column')
            mt = scipy.io.loadmat(d + '/types.mat')
            out['mat_types'] = [mt[k].ravel().astype(float).tolist() for k in ('time_s', 'current_measured_A', 'velocity_rad_s')]
            m = scipy.io.loadmat(d + '/vec.mat')
            out['mat'] = [m['time_s'].ravel().tolist(), m['current_measured_A'].ravel().tolist(), m['velocity_rad_s'].ravel().tolist()]
            s = scipy.io.loadmat(d + '/struct.mat')['scope'][0, 0]
            out['mat_struct_si'] = [(s['iq_mA'].ravel() * 1e-3).tolist(), (s['v_rpm'].ravel() * 2 * np.pi / 60).tolist()]
            # 9 frequency responses: dB/deg with coherence; real/imag with decimal commas and semicolons
            f = np.logspace(0, 3, 120)
            s_ = 2j * np.pi * f
            H = 40.0 / (s_ * (0.002 * s_ + 1)) * np.exp(-s_ * 1e-4)
            coh = np.clip(0.5 + 0.5 * np.cos(f / 200), 0, 1)
            np.savetxt(d + '/frf_db.csv', np.column_stack([f, 20 * np.log10(np.abs(H)), np.degrees(np.unwrap(np.angle(H))), coh]), delimiter=',',
                       header='frequency_Hz,magnitude_dB,phase_deg,coherence', comments='# exported by numpy\\n', fmt='%.12g')
            x = np.loadtxt(d + '/frf_db.csv', delimiter=',', skiprows=2)
            Hd = 10 ** (x[:, 1] / 20) * np.exp(1j * np.radians(x[:, 2]))
            out['frf_db'] = [x[:, 0].tolist(), Hd.real.tolist(), Hd.imag.tolist(), x[:, 3].tolist()]
            lines = ['Freq [Hz];Re;Im']
            vals = []
            for fi, h in zip(f, H):
                txt = [('%.12g' % v).replace('.', ',') for v in (fi, h.real, h.imag)]
                vals.append([float(v.replace(',', '.')) for v in txt])
                lines.append(';'.join(txt))
            with open(d + '/frf_ri.txt', 'w') as fo: fo.write('\\n'.join(lines) + '\\n')
            out['frf_ri'] = np.array(vals).T.tolist()
            print(json.dumps(out))
            """;

    @BeforeAll
    static void write() {
        PythonOracle.require("numpy", "scipy.io");
        ref = PythonOracle.run(SCRIPT, Map.of("dir", dir.toString(), "n", N, "fs", FS)).getAsJsonObject();
    }

    static double[] ref(String key, int i) { return PythonOracle.doubles(ref.getAsJsonArray(key).get(i)); }

    @Test
    void semicolonTabAndBlanksWithBomReadTheSameNumbersAsNumpyLoadtxt() throws IOException {
        for (String[] c : new String[][] {{"semi.csv", "semi"}, {"tab.txt", "tab"}, {"ws.txt", "ws"}}) {
            DriveLog log = DriveLogReader.read(dir.resolve(c[0]), OPT);
            // numpy.loadtxt and our parser both round correctly, so the doubles are identical
            assertArrayEquals(ref(c[1], 0), log.timeS(), 0.0, c[0]);
            assertArrayEquals(ref(c[1], 1), log.measuredCurrentA(), 0.0, c[0]);
            assertArrayEquals(ref(c[1], 2), log.velocityRadPerS(), 0.0, c[0]);
            assertEquals(FS, log.sampleRateHz(), 1e-6 * FS, c[0]);
        }
        assertEquals("demo drive 7", DriveLogReader.read(dir.resolve("tab.txt"), OPT).metadata().get("drive"));
    }

    @Test
    void scopeExportWithDecimalCommaCountsRpmMmPerSMilliampsAndVoltsBecomesSi() throws IOException {
        ColumnMap map = ColumnMap.of()
                .column("Pos[inc]", Quantity.POSITION, LogUnit.countsPerMetre(4000))
                .column("Vel[rpm]", Quantity.VELOCITY, LogUnit.rpm())
                .column("V[mm/s]", "load_velocity", LogUnit.millimetresPerSecond())
                .column("Iq[mA]", Quantity.CURRENT_MEASURED, LogUnit.milliamperes())
                .column("F[V]", Quantity.FORCE, LogUnit.volts("N", 125));
        DriveLog log = DriveLogReader.read(dir.resolve("scope.csv"), map, OPT);
        assertEquals(8000, log.sampleRateHz(), 0.0, "stated in the file's metadata");
        assertEquals("Y", log.metadata().get("axis"));
        assertEquals(N, log.rows());
        assertEquals(1.0 / 8000, log.timeS()[1], 0.0);
        // conversions computed by numpy; the factor's rounding differs from numpy's order of operations by <= 2 ulp
        assertClose(ref("scope_si", 0), log.positionM());
        assertClose(ref("scope_si", 1), log.velocityRadPerS());
        assertClose(ref("scope_si", 2), log.column("load_velocity_m_s"));
        assertClose(ref("scope_si", 3), log.measuredCurrentA());
        assertClose(ref("scope_si", 4), log.forceN());
        assertTrue(log.columnSources().get("velocity_rad_s").contains("Vel[rpm]"), log.columnSources().toString());
        assertTrue(log.columnSources().get("time_s").contains("no time column"), log.columnSources().toString());
        assertTrue(log.dataset().isPresent() && log.dataset().get().sha256().length() == 64);
    }

    /** Time, measured current and velocity equal the reference's columns 0, 1 and 2 bit for bit. */
    static void assertColumnsExactly(String key, DriveLog log) {
        assertArrayEquals(ref(key, 0), log.timeS(), 0.0);
        assertArrayEquals(ref(key, 1), log.measuredCurrentA(), 0.0);
        assertArrayEquals(ref(key, 2), log.velocityRadPerS(), 0.0);
    }

    static void assertClose(double[] expected, double[] actual) {
        assertEquals(expected.length, actual.length);
        for (int i = 0; i < expected.length; i++) assertEquals(expected[i], actual[i], 1e-15 * Math.abs(expected[i]), "index " + i);
    }

    @Test
    void latin1IsRefusedWithLineAndFixThenReadWhenStated() throws IOException {
        Path f = dir.resolve("latin1.csv");
        String m = assertThrows(IllegalArgumentException.class, () -> DriveLogReader.read(f, OPT)).getMessage();
        // 'ü' is byte 0xFC in Latin-1, not valid UTF-8 (RFC 3629)
        assertTrue(m.contains(f.toString()) && m.contains("line 2") && m.contains("0xFC") && m.contains("encoding(StandardCharsets.ISO_8859_1)"), m);
        DriveLog log = DriveLogReader.read(f, LogFormat.detect().encoding(StandardCharsets.ISO_8859_1), ColumnMap.of(), OPT);
        assertEquals("Müller", log.metadata().get("operator"));
    }

    @Test
    void timestampsPrintedTo1usGiveTheTrueRateAndAWarning() throws IOException {
        DriveLog log = DriveLogReader.read(dir.resolve("q1us.csv"), OPT);
        // truth: the script's fs; the median step numpy finds is 62 or 63 us, i.e. off by about 0.8 %
        assertTrue(Math.abs(ref.get("q1us_median_rate").getAsDouble() - FS) / FS > 5e-3);
        assertEquals(FS, log.sampleRateHz(), 1e-4 * FS);
        assertTrue(log.warnings().stream().anyMatch(w -> w.message().contains("printed to 1.00e-06 s")), log.warnings().toString());
    }

    @Test
    void timestampsPrintedTo10usAreAcceptedWhenTheRateIsStatedAndTheStatedRateIsUsed() throws IOException {
        DriveLog log = DriveLogReader.read(dir.resolve("q10us.csv"), OPT.withSampleRateHz(FS));
        assertEquals(FS, log.sampleRateHz(), 0.0);
        // and a stated rate is authoritative over the time column
        DriveLog stated = DriveLogReader.read(dir.resolve("semi.csv"), OPT.withSampleRateHz(FS * 1.0005));
        assertEquals(FS * 1.0005, stated.sampleRateHz(), 0.0);
        assertTrue(stated.warnings().stream().anyMatch(w -> w.message().contains("the stated rate is used")), stated.warnings().toString());
    }

    @Test
    void millisecondsUnderATimeSHeaderAreRefusedWithTheFix() {
        Path f = dir.resolve("ms.csv");
        String m = assertThrows(IllegalArgumentException.class, () -> DriveLogReader.read(f, OPT)).getMessage();
        assertTrue(m.contains(f.toString()) && m.contains("16 Hz") && m.contains("time_ms") && m.contains("withSampleRateHz"), m);
        m = assertThrows(IllegalArgumentException.class, () -> DriveLogReader.read(f, OPT.withSampleRateHz(FS))).getMessage();
        assertTrue(m.contains("does not match the stated sample rate") && m.contains("time_ms"), m);
    }

    @Test
    void matV5VectorsAndACompressedStructOfLabUnits() throws IOException {
        DriveLog log = DriveLogReader.read(dir.resolve("vec.mat"), OPT);
        assertColumnsExactly("mat", log);
        assertEquals("bench run 3", log.metadata().get("note"));
        DriveLog s = DriveLogReader.read(dir.resolve("struct.mat"), ColumnMap.of()
                .column("iq_mA", Quantity.CURRENT_MEASURED, LogUnit.milliamperes()).column("v_rpm", Quantity.VELOCITY, LogUnit.rpm()), OPT);
        assertEquals(FS, s.sampleRateHz(), 0.0);
        assertClose(ref("mat_struct_si", 0), s.measuredCurrentA());
        assertClose(ref("mat_struct_si", 1), s.velocityRadPerS());
    }

    /** Our Level 5 reader on other stored types, against scipy.io.loadmat of the same file; a cut file is a clear error. */
    @Test
    void matOtherStoredTypesAndATruncatedFile() throws IOException {
        DriveLog log = DriveLogReader.read(dir.resolve("types.mat"), OPT);
        assertColumnsExactly("mat_types", log);
        assertTrue(log.metadata().get("tags").contains("cell array") && log.metadata().get("tags").contains("not read"), log.metadata().toString());
        byte[] whole = Files.readAllBytes(dir.resolve("vec.mat"));
        Path cut = dir.resolve("cut.mat");
        Files.write(cut, java.util.Arrays.copyOf(whole, whole.length / 2));
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> DriveLogReader.read(cut, OPT));
        assertTrue(e.getMessage().contains("cannot read as a Level 5 .mat file") && e.getMessage().contains("truncated"), e.getMessage());
    }

    @Test
    void frequencyResponseFilesInDbDegAndInRealImagWithDecimalCommas() throws IOException {
        Frf a = FrfFileReader.read(dir.resolve("frf_db.csv"));
        double[] f = ref("frf_db", 0);
        assertArrayEquals(f, a.frequencyHz(), 1e-12 * 1000);
        // 10^(dB/20)·e^{j·deg} by numpy against Math.pow/cos/sin: a few ulp
        for (int i = 0; i < f.length; i++) {
            double mag = Math.hypot(ref("frf_db", 1)[i], ref("frf_db", 2)[i]);
            assertEquals(ref("frf_db", 1)[i], a.realAt(i), 1e-13 * mag);
            assertEquals(ref("frf_db", 2)[i], a.imagAt(i), 1e-13 * mag);
        }
        assertArrayEquals(ref("frf_db", 3), a.coherence().orElseThrow(), 0.0);
        Frf b = FrfFileReader.read(dir.resolve("frf_ri.txt"));
        assertArrayEquals(ref("frf_ri", 1), b.real(), 0.0);
        assertArrayEquals(ref("frf_ri", 2), b.imag(), 0.0);
        assertArrayEquals(ref("frf_ri", 0), b.frequencyHz(), 1e-12 * 1000);
    }
}
