package org.loopledger.ident.log;

import org.junit.jupiter.api.Test;

import java.util.Locale;
import java.util.Random;
import java.util.function.BiFunction;

import static org.junit.jupiter.api.Assertions.*;

/** Every log defect gives a clear error or warning naming the column and the row (common practice for data checks). */
class DriveLogReaderTest {
    static final double FS = 16000;
    static final LogCheckOptions OPT = LogCheckOptions.defaults().withMinimumSamples(100);

    /** A clean 200-row log; {@code edit} may rewrite any cell (row r, column c) as text. */
    static String csv(int rows, BiFunction<Integer, Integer, String> edit) {
        StringBuilder sb = new StringBuilder("time_s,current_injected_A,current_measured_A,velocity_rad_s\n");
        Random r = new Random(3);
        for (int i = 0; i < rows; i++) {
            String[] cells = {String.format(Locale.ROOT, "%.7f", i / FS), r.nextBoolean() ? "1" : "-1",
                    Double.toString(0.1 * r.nextGaussian()), Double.toString(r.nextGaussian())};
            for (int c = 0; c < cells.length; c++) {
                String e = edit.apply(i + 1, c);
                sb.append(e != null ? e : cells[c]).append(c < cells.length - 1 ? "," : "\n");
            }
        }
        return sb.toString();
    }

    static String error(String csv) {
        return assertThrows(IllegalArgumentException.class, () -> DriveLogReader.readString("test.csv", csv, OPT)).getMessage();
    }

    @Test
    void cleanLogLoads() {
        DriveLog log = DriveLogReader.readString("test.csv", csv(200, (r, c) -> null), OPT);
        assertEquals(200, log.rows());
        assertEquals(FS, log.sampleRateHz(), 1e-6);
        assertTrue(log.warnings().isEmpty(), log.warnings().toString());
        assertEquals(200, log.velocityRadPerS().length);
    }

    @Test
    void nanAndEmptyCellsNameColumnAndRow() {
        String m = error(csv(200, (r, c) -> r == 57 && c == 3 ? "NaN" : null));
        assertTrue(m.contains("column velocity_rad_s, row 57 (line 58)"), m);
        m = error(csv(200, (r, c) -> r == 12 && c == 2 ? "" : null));
        assertTrue(m.contains("column current_measured_A, row 12"), m);
    }

    @Test
    void nonMonotonicTime() {
        String m = error(csv(200, (r, c) -> r == 80 && c == 0 ? String.format(Locale.ROOT, "%.7f", 70 / FS) : null));
        assertTrue(m.contains("column time_s, row 80") && m.contains("does not increase"), m);
    }

    @Test
    void gapAndJitter() {
        String m = error(csv(200, (r, c) -> c == 0 && r > 100 ? String.format(Locale.ROOT, "%.7f", (r + 4) / FS) : null));
        assertTrue(m.contains("column time_s, row 101") && m.contains("gap"), m);
        // 5 % early sample: above the 1 % warning, below the 10 % error
        DriveLog log = DriveLogReader.readString("j.csv", csv(200, (r, c) -> c == 0 && r == 50 ? String.format(Locale.ROOT, "%.9f", (49 - 0.05) / FS) : null), OPT);
        assertEquals(1, log.warnings().size());
        assertTrue(log.warnings().get(0).toString().contains("row 50") && log.warnings().get(0).toString().contains("jitter"), log.warnings().toString());
        // 30 % early: error
        m = error(csv(200, (r, c) -> c == 0 && r == 50 ? String.format(Locale.ROOT, "%.9f", (49 - 0.3) / FS) : null));
        assertTrue(m.contains("row 50") && m.contains("jitter"), m);
    }

    @Test
    void clippedCurrentIsAWarning() {
        DriveLog log = DriveLogReader.readString("c.csv", csv(200, (r, c) -> c == 2 && r >= 120 && r < 135 ? "9.5" : null), OPT);
        assertEquals(1, log.warnings().size(), log.warnings().toString());
        String w = log.warnings().get(0).toString();
        assertTrue(w.contains("column current_measured_A, row 120") && w.contains("saturated"), w);
    }

    @Test
    void tooShortWrongRateAndBadHeaders() {
        String m = assertThrows(IllegalArgumentException.class, () -> DriveLogReader.readString("s.csv", csv(50, (r, c) -> null), OPT)).getMessage();
        assertTrue(m.contains("50 rows") && m.contains("100"), m);
        m = assertThrows(IllegalArgumentException.class, () -> DriveLogReader.readString("s.csv", csv(200, (r, c) -> null), OPT.withSampleRateHz(8000))).getMessage();
        assertTrue(m.contains("8000.00 Hz") && m.contains("does not match"), m);
        m = assertThrows(IllegalArgumentException.class, () -> DriveLogReader.readString("h.csv", "time_s,Speed[rpm]\n0,1\n", OPT)).getMessage();
        assertTrue(m.contains("Speed[rpm]") && m.contains("quantity_unit"), m);
        m = assertThrows(IllegalArgumentException.class, () -> DriveLogReader.readString("h.csv", "current_measured_A\n1\n", OPT)).getMessage();
        assertTrue(m.contains("no time column") && m.contains("sampleRateHz"), m);
        m = assertThrows(IllegalArgumentException.class, () -> DriveLogReader.readString("h.csv", csv(200, (r, c) -> r == 9 && c == 1 ? "abc" : null), OPT)).getMessage();
        assertTrue(m.contains("line 10, column 'current_injected_A' (field 2): 'abc' is not a number"), m);
    }

    @Test
    void headerConvention() {
        assertEquals("rad/s", LogColumns.parse("velocity_rad_s").unit());
        assertEquals("velocity", LogColumns.parse("velocity_rad_s").quantity());
        assertEquals("rad/s²", LogColumns.parse("acceleration_rad_s2").unit());
        assertEquals("current_measured", LogColumns.parse("current_measured_A").quantity());
        assertEquals("rad", LogColumns.parse("position_rad").unit());
        assertThrows(IllegalArgumentException.class, () -> LogColumns.parse("Velocity_rad_s"));
        assertThrows(IllegalArgumentException.class, () -> LogColumns.parse("_A"));
    }
}
