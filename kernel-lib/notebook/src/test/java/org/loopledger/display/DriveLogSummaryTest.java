package org.loopledger.display;

import org.jsoup.Jsoup;
import org.jsoup.nodes.Document;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.loopledger.ident.log.ColumnMap;
import org.loopledger.ident.log.DriveLog;
import org.loopledger.ident.log.DriveLogReader;
import org.loopledger.ident.log.LogCheckOptions;
import org.loopledger.ident.log.LogUnit;
import org.loopledger.ident.log.Quantity;

import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.util.HexFormat;
import java.util.List;

import static org.junit.jupiter.api.Assertions.*;

/** A log as read: file, digest, rows, rate, where each SI column came from, metadata and the checks' warnings. */
class DriveLogSummaryTest {
    @Test
    void aScopeExportShowsItsColumnsMetadataAndDigest(@TempDir Path dir) throws Exception {
        StringBuilder csv = new StringBuilder("# sample_rate_Hz = 1000\n# axis = Y <placement>\nVel [mm/s],Iq [mA]\n");
        for (int i = 0; i < 5000; i++) csv.append(i % 7).append(".5,").append(100 + i % 3).append('\n');
        Path f = dir.resolve("scope.csv");
        Files.writeString(f, csv);
        ColumnMap map = ColumnMap.of().column("Vel [mm/s]", Quantity.VELOCITY, LogUnit.millimetresPerSecond())
                .column("Iq [mA]", Quantity.CURRENT_MEASURED, LogUnit.milliamperes());
        DriveLog log = DriveLogReader.read(f, map, LogCheckOptions.defaults());

        MimeBundle b = Bundles.of(log);   // registered: a cell ending with the log shows this
        String text = b.plainText();
        // 5000 rows at the stated 1000 Hz: 5 s
        // the file's name only: its folder depends on where the notebook runs, and verify compares runs from elsewhere
        assertTrue(text.startsWith("Log scope.csv: 5000 rows at 1000 Hz (5 s)\n"), text);
        assertFalse(text.contains(dir.toString()), text);
        assertEquals("a.csv", DriveLogSummary.fileName("../datasets/a.csv"));
        assertEquals("a.csv", DriveLogSummary.fileName("C:\\logs\\a.csv"));
        assertEquals("inline", DriveLogSummary.fileName("inline"));
        // SHA-256 of the file's bytes by the JDK's MessageDigest (FIPS 180-4), and the size in bytes
        String sha = HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(Files.readAllBytes(f)));
        assertTrue(text.contains("SHA-256 " + sha + " (" + Files.size(f) + " bytes)"), text);
        Document d = Jsoup.parse(b.get(MimeBundle.TEXT_HTML).orElseThrow());
        // every SI column with its origin, as the reader states it
        for (var e : log.columnSources().entrySet()) assertEquals(List.of(e.getKey(), e.getValue()), ResultTablesTest.row(d, e.getKey()));
        assertTrue(log.columnSources().get("velocity_m_s").contains("Vel [mm/s]"), log.columnSources().toString());
        assertTrue(text.contains("  # axis: Y <placement>\n"), text);
        assertTrue(d.select("li").eachText().contains("axis: Y <placement>"), "metadata escaped as text in HTML");
        assertTrue(text.endsWith("Log checks: no warning"), text);
    }

    @Test
    void warningsAreListedOneByOne(@TempDir Path dir) throws Exception {
        // one time step 5 % long: jitter above 1 % is flagged by LogCheckOptions.defaults() (see LoadCaseTableTest)
        DriveLog log = DriveLogReader.read(LoadCaseTableTest.log(dir, "jitter.csv", true), LogCheckOptions.defaults());
        assertFalse(log.warnings().isEmpty());
        MimeBundle b = DriveLogSummary.render(log);
        int n = log.warnings().size();
        assertTrue(b.plainText().contains("Log checks: " + n + (n == 1 ? " warning" : " warnings")), b.plainText());
        for (var w : log.warnings()) assertTrue(b.plainText().contains("\n  " + w), b.plainText());
        Document d = Jsoup.parse(b.get(MimeBundle.TEXT_HTML).orElseThrow());
        assertEquals(n, d.select("ul.loopledger-warnings li").size());
        // a log with its SI header: each column read from the file's column of that name
        assertTrue(ResultTablesTest.row(d, "velocity_rad_s").get(1).contains("velocity_rad_s"), d.text());
    }
}
