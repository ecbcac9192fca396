package org.loopledger.provenance;

import java.io.IOException;
import java.io.InputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.DigestInputStream;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.ArrayList;
import java.util.HexFormat;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * What a session read: every dataset file a loader opened, with its SHA-256, so that a tuning record
 * can state exactly which data it was computed from. Loaders call {@link #recordDataset}; the
 * notebook runner reads {@link #datasetsJson()} after every cell through the session's control channel
 * (an extension command of the JShell agent, not the cell's standard output, which a cell may redirect
 * with {@code System.setOut}). Thread-safe; one registry per JVM.
 */
public final class Provenance {
    /** A dataset file as read: path as given by the user, size and SHA-256 of its bytes. */
    public record Dataset(String path, long bytes, String sha256) {
        @Override public String toString() { return path + " (" + bytes + " bytes, SHA-256 " + sha256 + ")"; }
    }

    private static final Map<String, Dataset> DATASETS = new LinkedHashMap<>();
    /** How often each path was read, so the runner can tell which cell read a file read before. */
    private static final Map<String, Long> READS = new LinkedHashMap<>();

    private Provenance() {}

    /** Records that {@code file} was read; returns its digest. Reading the same path again updates the entry. */
    public static synchronized Dataset recordDataset(Path file) {
        Dataset d = digest(file);
        DATASETS.put(d.path(), d);
        READS.merge(d.path(), 1L, Long::sum);
        return d;
    }

    /** The datasets read so far, in first-read order. */
    public static synchronized List<Dataset> datasets() { return new ArrayList<>(DATASETS.values()); }

    /** Forgets everything (a new session). */
    public static synchronized void clear() {
        DATASETS.clear();
        READS.clear();
    }

    /** SHA-256 of a file's bytes. */
    public static Dataset digest(Path file) {
        try (InputStream in = new DigestInputStream(Files.newInputStream(file), MessageDigest.getInstance("SHA-256"))) {
            byte[] buf = new byte[1 << 16];
            long n = 0;
            for (int r; (r = in.read(buf)) > 0; ) n += r;
            byte[] h = ((DigestInputStream) in).getMessageDigest().digest();
            return new Dataset(file.toString(), n, HexFormat.of().formatHex(h));
        } catch (IOException e) {
            throw new IllegalArgumentException("cannot read dataset " + file + ": " + e.getMessage());
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException(e);
        }
    }

    /** The datasets as a JSON array (path, bytes, sha256, reads), for the runner to carry across the JShell boundary. */
    public static synchronized String datasetsJson() {
        StringBuilder sb = new StringBuilder("[");
        boolean first = true;
        for (Dataset d : DATASETS.values()) {
            if (!first) sb.append(',');
            first = false;
            sb.append("{\"path\":\"").append(escape(d.path())).append("\",\"bytes\":").append(d.bytes())
                    .append(",\"sha256\":\"").append(d.sha256()).append("\",\"reads\":").append(READS.getOrDefault(d.path(), 1L)).append('}');
        }
        return sb.append(']').toString();
    }

    private static String escape(String s) {
        StringBuilder sb = new StringBuilder();
        for (char c : s.toCharArray()) {
            if (c == '"' || c == '\\') sb.append('\\').append(c);
            else if (c < 0x20) sb.append(String.format("\\u%04x", (int) c));
            else sb.append(c);
        }
        return sb.toString();
    }
}
