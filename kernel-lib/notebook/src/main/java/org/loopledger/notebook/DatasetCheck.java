package org.loopledger.notebook;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.function.Function;

/**
 * {@code verify}'s check of the data: every dataset the notebook's metadata records must be read again
 * on re-run with the same SHA-256, and the re-run must read no dataset the record does not list. Outputs
 * that happen not to depend on a changed column would otherwise let a record claim data it was not
 * computed from.
 *
 * <p>A stored dataset is matched to a re-run one by its path as the notebook gave it, else by file name
 * when exactly one re-run dataset has that name (a notebook may find {@code datasets/} from another
 * working folder as {@code ../datasets/}).
 */
public final class DatasetCheck {
    private DatasetCheck() {}

    /**
     * The problems found, one line each (empty when the data are the recorded data).
     *
     * @param readers the notebook cells (1-based) that read each re-run dataset path
     */
    public static List<String> compare(List<RecordInfo.DatasetDigest> stored, List<RecordInfo.DatasetDigest> rerun, Function<String, List<Integer>> readers) {
        List<String> problems = new ArrayList<>();
        List<RecordInfo.DatasetDigest> unmatched = new ArrayList<>(rerun);
        for (RecordInfo.DatasetDigest s : stored) {
            RecordInfo.DatasetDigest r = match(s, unmatched);
            if (r == null) {
                problems.add("dataset " + s.path() + " (SHA-256 " + s.sha256() + ") is recorded in the notebook but was not read on re-run");
                continue;
            }
            unmatched.remove(r);
            if (!r.sha256().equals(s.sha256())) {
                problems.add("dataset " + s.path() + " has changed: SHA-256 recorded " + s.sha256() + " (" + s.bytes() + " bytes), now "
                        + r.sha256() + " (" + r.bytes() + " bytes" + (r.path().equals(s.path()) ? "" : ", read as " + r.path()) + "); read by "
                        + cells(readers.apply(r.path())));
            }
        }
        for (RecordInfo.DatasetDigest r : unmatched) {
            problems.add("dataset " + r.path() + " (SHA-256 " + r.sha256() + ") was read on re-run by " + cells(readers.apply(r.path()))
                    + " but the notebook does not record it; re-run it with './loopledger run NOTEBOOK --in-place' to record its data");
        }
        return problems;
    }

    private static RecordInfo.DatasetDigest match(RecordInfo.DatasetDigest s, List<RecordInfo.DatasetDigest> candidates) {
        for (RecordInfo.DatasetDigest r : candidates) if (r.path().equals(s.path())) return r;
        String name = fileName(s.path());
        RecordInfo.DatasetDigest only = null;
        for (RecordInfo.DatasetDigest r : candidates) {
            if (fileName(r.path()).equals(name)) {
                if (only != null) return null;
                only = r;
            }
        }
        return only;
    }

    private static String fileName(String path) {
        try {
            Path p = Path.of(path).getFileName();
            return p == null ? path : p.toString();
        } catch (RuntimeException e) {
            return path;
        }
    }

    private static String cells(List<Integer> cells) {
        if (cells == null || cells.isEmpty()) return "no cell known";
        StringBuilder sb = new StringBuilder(cells.size() == 1 ? "cell " : "cells ");
        for (int i = 0; i < cells.size(); i++) sb.append(i == 0 ? "" : ", ").append(cells.get(i));
        return sb.toString();
    }

    /** The datasets recorded in a notebook's {@code loopledger} metadata, or null when it has none. */
    public static List<RecordInfo.DatasetDigest> recorded(Notebook nb) {
        try {
            return NotebookRunner.recordInfo(nb, "notebook", "").datasets();
        } catch (IllegalArgumentException e) {
            return null;
        }
    }
}
