package org.loopledger.ident.log;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;

import static org.junit.jupiter.api.Assertions.*;

/**
 * Every refusal names the file, the line or column, and the fix (issue 9; common practice for data
 * import errors); warnings for dead channels come at read time.
 */
class LogRefusalsTest {
    static final LogCheckOptions OPT = LogCheckOptions.defaults().withMinimumSamples(100);
    @TempDir Path dir;

    /** 200 rows at 8 kHz with the given separator and decimal mark; column 3 from {@code third}. */
    static String log(String header, char sep, boolean decimalComma, java.util.function.IntToDoubleFunction third) {
        StringBuilder sb = new StringBuilder(header).append('\n');
        for (int k = 0; k < 200; k++) {
            String[] v = {String.format(Locale.ROOT, "%.7f", k / 8000.0), String.format(Locale.ROOT, "%.4f", Math.sin(k * 0.1)),
                    String.format(Locale.ROOT, "%.4f", third.applyAsDouble(k))};
            if (decimalComma) for (int i = 0; i < 3; i++) v[i] = v[i].replace('.', ',');
            sb.append(String.join(String.valueOf(sep), v)).append('\n');
        }
        return sb.toString();
    }

    String refusal(String name, String text, LogFormat f, ColumnMap m, LogCheckOptions o) throws IOException {
        Path p = dir.resolve(name);
        Files.writeString(p, text, StandardCharsets.UTF_8);
        String msg = assertThrows(IllegalArgumentException.class, () -> DriveLogReader.read(p, f, m, o)).getMessage();
        assertTrue(msg.contains(p.toString()), "names the file: " + msg);
        return msg;
    }

    @Test
    void statedCommaOnASemicolonFileSaysSemicolon() throws IOException {
        String m = refusal("a.csv", log("time_s;current_measured_A;velocity_rad_s", ';', false, Math::cos), LogFormat.detect().separator(','), ColumnMap.of(), OPT);
        // the header reads as one name; the first data line's cell then carries semicolons
        assertTrue(m.contains("line 2, column 'time_s;current_measured_A;velocity_rad_s' (field 1)"), m);
        assertTrue(m.contains("semicolon-separated? pass LogFormat.detect().separator(';')"), m);
    }

    @Test
    void decimalCommaStatedAsPointSaysDecimalComma() throws IOException {
        String m = refusal("c.csv", log("time_s;current_measured_A;velocity_rad_s", ';', true, Math::cos), LogFormat.detect().decimalPoint(), ColumnMap.of(), OPT);
        assertTrue(m.contains("line 2, column 'time_s' (field 1): '0,0000000' is not a number; decimal comma? pass LogFormat.detect().decimalComma()"), m);
        // detected without being stated
        DriveLog ok = DriveLogReader.readString("d.csv", log("time_s;current_measured_A;velocity_rad_s", ';', true, Math::cos), OPT);
        assertEquals(8000, ok.sampleRateHz(), 1e-6);
    }

    @Test
    void raggedLineAndBadCellNameLineAndColumn() throws IOException {
        String text = log("time_s,current_measured_A,velocity_rad_s", ',', false, Math::cos);
        String[] lines = text.split("\n");
        lines[57] = lines[57].substring(0, lines[57].lastIndexOf(','));
        String m = refusal("e.csv", String.join("\n", lines), LogFormat.detect(), ColumnMap.of(), OPT);
        assertTrue(m.contains("line 58 has 2 field(s), the header has 3") && m.contains("repair or cut that line"), m);
        lines = text.split("\n");
        lines[99] = lines[99].replaceFirst(",[^,]*$", ",n/a");
        m = refusal("f.csv", String.join("\n", lines), LogFormat.detect(), ColumnMap.of(), OPT);
        assertTrue(m.contains("line 100, column 'velocity_rad_s' (field 3): 'n/a' is not a number") && m.contains("NaN to mark a missing value"), m);
    }

    @Test
    void headerProblemsNameTheLineAndTheFix() throws IOException {
        String m = refusal("g.csv", log("time_s,Speed [rpm],velocity_rad_s", ',', false, Math::cos), LogFormat.detect(), ColumnMap.of(), OPT);
        assertTrue(m.contains("line 1 (header), field 2") && m.contains("ColumnMap.of().column(\"Speed [rpm]\""), m);
        m = refusal("h.csv", log("current_injected_A,current_measured_A,velocity_rad_s", ',', false, Math::cos), LogFormat.detect(), ColumnMap.of(), OPT);
        assertTrue(m.contains("no time column") && m.contains("sampleRateHz(8000)") && m.contains("# sample_rate_Hz = 8000"), m);
        m = refusal("i.csv", log("time_s,current_measured_A,velocity_rad_s", ',', false, Math::cos), LogFormat.detect(),
                ColumnMap.of().column("Vel", Quantity.VELOCITY, LogUnit.rpm()), OPT);
        assertTrue(m.contains("the column map names 'Vel', which the file does not have") && m.contains("velocity_rad_s"), m);
        m = refusal("j.csv", "0.1,0.2\n0.3,0.4\n", LogFormat.detect(), ColumnMap.of(), OPT);
        assertTrue(m.contains("line 1: numbers where the header row") && m.contains("add a header row"), m);
        m = refusal("k.csv", log("time_s,velocity_rpm,velocity_rad_s", ',', false, Math::cos), LogFormat.detect(), ColumnMap.of(), OPT);
        assertTrue(m.contains("two columns become velocity_rad_s"), m);
        assertThrows(IllegalArgumentException.class, () -> ColumnMap.of().column("x", Quantity.VELOCITY, LogUnit.milliamperes()));
    }

    @Test
    void bomIsSkippedAndUtf16IsRefusedWithTheFix() throws IOException {
        Path p = dir.resolve("bom.csv");
        byte[] body = log("time_s,current_measured_A,velocity_rad_s", ',', false, Math::cos).getBytes(StandardCharsets.UTF_8);
        byte[] withBom = new byte[body.length + 3];
        withBom[0] = (byte) 0xEF;
        withBom[1] = (byte) 0xBB;
        withBom[2] = (byte) 0xBF;
        System.arraycopy(body, 0, withBom, 3, body.length);
        Files.write(p, withBom);
        assertEquals(200, DriveLogReader.read(p, OPT).rows());
        Path q = dir.resolve("u16.csv");
        Files.write(q, log("time_s,current_measured_A,velocity_rad_s", ',', false, Math::cos).getBytes(StandardCharsets.UTF_16));
        String m = assertThrows(IllegalArgumentException.class, () -> DriveLogReader.read(q, OPT)).getMessage();
        assertTrue(m.contains(q.toString()) && m.contains("UTF-16") && m.contains("UTF-8"), m);
    }

    @Test
    void deadChannelIsAWarningAtReadTime() {
        DriveLog log = DriveLogReader.readString("dead.csv", log("time_s,current_measured_A,velocity_rad_s", ',', false, k -> 0), OPT);
        assertTrue(log.warnings().stream().anyMatch(w -> w.column().equals("velocity_rad_s") && w.message().contains("dead channel")), log.warnings().toString());
    }

    @Test
    void commentsAmongTheDataAreSkippedAndMetadataKept() {
        String text = "# drive = test\n# sample_rate_Hz = 8000\n" + log("current_measured_A;velocity_rpm;x_mm", ';', true, Math::cos).replace("\n0,0125", "\n# pause\n0,0125");
        // no time column: the rate comes from the metadata; first column here is sin (current), then rpm, then mm
        DriveLog log = DriveLogReader.readString("m.csv", text.replaceFirst("current_measured_A;velocity_rpm;x_mm", "current_measured_A;velocity_rpm;position_mm"), OPT);
        assertEquals(8000, log.sampleRateHz(), 0.0);
        assertEquals("test", log.metadata().get("drive"));
        assertEquals(Math.sin(0.1) * 2 * Math.PI / 60, log.velocityRadPerS()[1], 1e-4 * 2 * Math.PI / 60, "rpm → rad/s");
    }

    /** Level 5 MAT-file header layout (the published MAT-file format: 116-byte text, 8-byte offset, version, endian indicator). */
    @Test
    void matFilesOfAnotherVersionAreRefusedByTheirHeaderStructure() throws IOException {
        byte[] v73 = new byte[512];
        v73[124] = 0x00; v73[125] = 0x02; v73[126] = 'I'; v73[127] = 'M';   // version 0x0200, little-endian
        Path hdf = dir.resolve("v73.mat");
        Files.write(hdf, v73);
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> DriveLogReader.read(hdf, OPT));
        assertTrue(e.getMessage().contains("7.3") && e.getMessage().contains("-v7"), e.getMessage());
        Path text = dir.resolve("notmat.mat");
        Files.writeString(text, "time_s,velocity_rad_s\n0,1\n", StandardCharsets.UTF_8);
        e = assertThrows(IllegalArgumentException.class, () -> DriveLogReader.read(text, OPT));
        assertTrue(e.getMessage().contains("not a Level 5 .mat file") && e.getMessage().contains("savemat"), e.getMessage());
    }
}
