package org.loopledger.notebook;

import org.junit.jupiter.api.Test;

import java.util.List;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.*;

/** {@code verify}'s dataset check on hand-made digests (the hashes are placeholders; only equality matters). */
class DatasetCheckTest {
    private static RecordInfo.DatasetDigest d(String path, String sha) { return new RecordInfo.DatasetDigest(path, 10, sha); }

    private static final Map<String, List<Integer>> READERS = Map.of("datasets/a.csv", List.of(2, 4), "../datasets/b.csv", List.of(3),
            "extra.csv", List.of(5));

    @Test
    void theSameDataPass() {
        assertEquals(List.of(), DatasetCheck.compare(List.of(d("datasets/a.csv", "aa")), List.of(d("datasets/a.csv", "aa")), READERS::get));
    }

    @Test
    void aChangedDigestIsNamedWithTheCellsThatReadIt() {
        List<String> p = DatasetCheck.compare(List.of(d("datasets/a.csv", "aa")), List.of(d("datasets/a.csv", "ab")), READERS::get);
        assertEquals(1, p.size());
        assertTrue(p.get(0).contains("datasets/a.csv has changed") && p.get(0).contains("read by cells 2, 4"), p.get(0));
    }

    @Test
    void aDatasetFoundFromAnotherFolderMatchesByFileName() {
        assertEquals(List.of(), DatasetCheck.compare(List.of(d("datasets/b.csv", "bb")), List.of(d("../datasets/b.csv", "bb")), READERS::get));
        List<String> p = DatasetCheck.compare(List.of(d("datasets/b.csv", "bb")), List.of(d("../datasets/b.csv", "bc")), READERS::get);
        assertTrue(p.get(0).contains("read as ../datasets/b.csv") && p.get(0).contains("read by cell 3"), p.get(0));
    }

    @Test
    void missingAndUnrecordedDatasetsFail() {
        List<String> p = DatasetCheck.compare(List.of(d("datasets/a.csv", "aa")), List.of(d("extra.csv", "ee")), READERS::get);
        assertEquals(2, p.size(), p.toString());
        assertTrue(p.get(0).contains("not read on re-run"), p.get(0));
        assertTrue(p.get(1).contains("extra.csv") && p.get(1).contains("does not record it") && p.get(1).contains("cell 5"), p.get(1));
    }
}
