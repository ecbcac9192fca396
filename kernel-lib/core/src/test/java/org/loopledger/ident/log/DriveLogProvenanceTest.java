package org.loopledger.ident.log;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.loopledger.provenance.Provenance;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;

import static org.junit.jupiter.api.Assertions.*;

/** Reading a log from a file records it for the tuning record (issue: "the SHA-256 of every dataset the notebook read"). */
class DriveLogProvenanceTest {

    /** 64 rows at 1 kHz, the same text as written by a one-line Python script (see below). */
    static String csv() {
        StringBuilder sb = new StringBuilder("time_s,current_measured_A,velocity_rad_s\n");
        for (int k = 0; k < 64; k++) sb.append(String.format(Locale.ROOT, "%.3f,%.1f,%.2f%n", k / 1000.0, (k % 7) / 10.0, (k % 5) / 4.0));
        return sb.toString();
    }

    @Test
    void readingAFileRecordsItsDigest(@TempDir Path dir) throws IOException {
        Path f = dir.resolve("axis.csv");
        Files.writeString(f, csv());
        DriveLog log = DriveLogReader.read(f, LogCheckOptions.defaults().withMinimumSamples(16));
        assertEquals(64, log.rows());
        Provenance.Dataset d = Provenance.datasets().stream().filter(x -> x.path().equals(f.toString())).findFirst()
                .orElseThrow(() -> new AssertionError("not recorded: " + Provenance.datasets()));
        // GNU coreutils sha256sum of the same 1001 bytes, written by Python:
        // rows = ["time_s,current_measured_A,velocity_rad_s"] + [f"{k/1000:.3f},{(k%7)/10:.1f},{(k%5)/4:.2f}" for k in range(64)]
        // open(p, 'w').write("\n".join(rows) + "\n")
        assertEquals(1001, d.bytes());
        assertEquals("81c5ace04d8199132b35d9556da1df0a70f59fe49e45f6493f928d38fb16fc63", d.sha256());
    }

    @Test
    void textFromACellIsNotADataset() {
        int before = Provenance.datasets().size();
        DriveLogReader.readString("pasted", csv(), LogCheckOptions.defaults().withMinimumSamples(16));
        assertEquals(before, Provenance.datasets().size());
    }
}
