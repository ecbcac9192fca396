package org.loopledger.ident.log;

import org.junit.jupiter.api.Test;

import java.io.ByteArrayInputStream;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.util.Locale;
import java.util.Random;

import static org.junit.jupiter.api.Assertions.*;

/** The streaming parser: numbers identical to the JDK's correctly rounded {@link Double#parseDouble}; columns that grow and trim. */
class DelimitedTextTest {
    static DelimitedText.Table read(String text, LogFormat f, long sizeHint) throws IOException {
        byte[] b = text.getBytes(StandardCharsets.UTF_8);
        return DelimitedText.read("t", new ByteArrayInputStream(b), sizeHint, f);
    }

    @Test
    void fastPathEqualsParseDoubleOnSeededRandomNumbers() throws IOException {
        // oracle: Double.parseDouble, correctly rounded by its specification (JLS / Double.valueOf)
        Random r = new Random(11);
        StringBuilder sb = new StringBuilder("a;b;c;d\n");
        String[][] cells = new String[20000][4];
        for (int i = 0; i < cells.length; i++) {
            double x = r.nextGaussian() * Math.pow(10, r.nextInt(12) - 6);
            cells[i][0] = String.format(Locale.ROOT, "%.9g", x);
            cells[i][1] = String.format(Locale.ROOT, "%.17g", x);
            cells[i][2] = String.format(Locale.ROOT, "%.6e", x);
            cells[i][3] = Double.toString(x);
            sb.append(String.join(";", cells[i])).append('\n');
        }
        DelimitedText.Table t = read(sb.toString(), LogFormat.detect(), 0);
        for (int i = 0; i < cells.length; i++) {
            for (int c = 0; c < 4; c++) assertEquals(Double.parseDouble(cells[i][c]), t.columns()[c][i], 0.0, cells[i][c]);
        }
        // decimal comma, same numbers
        DelimitedText.Table u = read(sb.toString().replace('.', ','), LogFormat.detect(), 0);
        assertTrue(u.decimalComma());
        for (int c = 0; c < 4; c++) assertArrayEquals(java.util.Arrays.copyOf(t.columns()[c], t.rows()), java.util.Arrays.copyOf(u.columns()[c], u.rows()), 0.0);
    }

    @Test
    void columnsGrowPastAnUnderestimateAndKeepAnOverestimate() throws IOException {
        StringBuilder sb = new StringBuilder("time_s,x_m\n");
        for (int i = 0; i < 5000; i++) sb.append(i).append(',').append(i % 3 == 0 ? "1.000000000000001" : "2").append('\n');
        String text = sb.toString();
        for (long hint : new long[] {0, 100, text.length(), 100L * text.length()}) {
            DelimitedText.Table t = read(text, LogFormat.detect(), hint);
            assertEquals(5000, t.rows());
            // capacity: the estimate plus slack, never trimmed by a copy (that would cost one more column at the peak)
            assertTrue(t.columns()[0].length >= 5000);
            assertEquals(4999, t.columns()[0][4999], 0.0);
            assertEquals(1.000000000000001, t.columns()[1][4998], 0.0);
        }
    }

    @Test
    void whitespaceAndTabsAndQuotedHeaderNames() throws IOException {
        DelimitedText.Table t = read("\"time_s\"\t\"velocity_rad_s\"\n0\t1.5\n0.001\t-2\n", LogFormat.detect(), 0);
        assertArrayEquals(new String[] {"time_s", "velocity_rad_s"}, t.names());
        assertEquals(-2, t.columns()[1][1], 0.0);
        DelimitedText.Table w = read("  time_s   velocity_rad_s \n 0   1.5\n0.001  -2  \n", LogFormat.detect(), 0);
        assertEquals(' ', w.separator());
        assertEquals(1.5, w.columns()[1][0], 0.0);
    }
}
