package org.loopledger.notebook;

import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.channels.FileChannel;
import java.nio.charset.StandardCharsets;
import java.nio.file.AccessDeniedException;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.DirectoryStream;
import java.nio.file.FileSystemException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.nio.file.StandardOpenOption;
import java.time.Duration;
import java.time.Instant;
import java.util.concurrent.ThreadLocalRandom;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * Atomic file replacement: the content goes to a temporary file in the same folder, is forced to
 * disk, then renamed over the target. A reader sees the old file or the new one, never half of one.
 *
 * <p>The temporary file is {@code .NAME.PID.RANDOM.tmp} beside the target {@code NAME} (hidden, with the
 * writing process's id). A process killed during a write (kill -9, power loss) leaves it behind; the next
 * write of the same target removes every such file whose process is no longer alive
 * ({@link #cleanStaleTemps}). Nothing else in the folder is touched.
 */
public final class AtomicFiles {
    /** Files older than this with the pre-pid pattern {@code .NAME.DIGITS.tmp} count as stale too. */
    private static final Duration LEGACY_STALE_AGE = Duration.ofHours(1);

    private AtomicFiles() {}

    public static void writeString(Path target, String content) {
        writeBytes(target, content.getBytes(StandardCharsets.UTF_8));
    }

    /** The new file gets the old file's permissions, or rw-r--r-- for a new file (temp files start as rw-------). */
    private static void keepPermissions(Path target, Path tmp) throws IOException {
        if (!Files.getFileStore(tmp).supportsFileAttributeView("posix")) return;
        var perms = Files.exists(target) ? Files.getPosixFilePermissions(target) : java.nio.file.attribute.PosixFilePermissions.fromString("rw-r--r--");
        Files.setPosixFilePermissions(tmp, perms);
    }

    /** The temporary file name for {@code target} written by this process. */
    static String tempName(Path target) {
        return "." + target.getFileName() + "." + ProcessHandle.current().pid() + "." + Long.toUnsignedString(ThreadLocalRandom.current().nextLong()) + ".tmp";
    }

    public static void writeBytes(Path target, byte[] content) {
        Path abs = target.toAbsolutePath();
        Path dir = abs.getParent();
        if (dir == null || !Files.isDirectory(dir)) {
            throw new IllegalArgumentException("cannot write " + target + ": the folder " + dir + " does not exist; create it first or choose another output path");
        }
        cleanStaleTemps(abs);
        Path tmp = null;
        try {
            tmp = Files.createFile(dir.resolve(tempName(abs)));
            keepPermissions(abs, tmp);
            try (FileChannel ch = FileChannel.open(tmp, StandardOpenOption.WRITE, StandardOpenOption.TRUNCATE_EXISTING)) {
                ByteBuffer b = ByteBuffer.wrap(content);
                while (b.hasRemaining()) ch.write(b);
                ch.force(true);
            }
            try {
                Files.move(tmp, abs, StandardCopyOption.ATOMIC_MOVE, StandardCopyOption.REPLACE_EXISTING);
            } catch (AtomicMoveNotSupportedException e) {
                Files.move(tmp, abs, StandardCopyOption.REPLACE_EXISTING);
            }
            tmp = null;
        } catch (IOException e) {
            throw new IllegalArgumentException("cannot write " + target + ": " + describe(e), e);
        } finally {
            if (tmp != null) {
                try { Files.deleteIfExists(tmp); } catch (IOException ignored) { /* best effort clean-up */ }
            }
        }
    }

    /**
     * Checks that a file can be created in {@code dir} by creating and deleting an empty temporary file
     * there (the only check that also holds for root, read-only mounts and immutable folders).
     *
     * @throws IllegalArgumentException naming the folder and the reason ("permission denied", ...)
     */
    public static void requireWritableFolder(Path dir, Path forTarget) {
        Path probe = dir.resolve(tempName(forTarget.toAbsolutePath()));
        try {
            Files.createFile(probe);
            Files.delete(probe);
        } catch (IOException e) {
            throw new IllegalArgumentException("cannot write " + forTarget + ": the folder " + dir + " is not writable (" + describe(e)
                    + "); choose another output path or fix the folder's permissions");
        }
    }

    /** "permission denied" for access errors (EACCES, EPERM), the file system's reason otherwise. */
    static String describe(IOException e) {
        if (e instanceof AccessDeniedException) return "permission denied";
        if (e instanceof FileSystemException fse && fse.getReason() != null) {
            String reason = fse.getReason();
            if (reason.toLowerCase(java.util.Locale.ROOT).contains("not permitted")) return "permission denied (" + reason + ")";
            return reason;
        }
        return String.valueOf(e.getMessage());
    }

    /**
     * Removes the temporary files a killed earlier write of {@code target} left beside it: names
     * {@code .NAME.PID.RANDOM.tmp} whose process {@code PID} is not alive, and files of the older pattern
     * {@code .NAME.DIGITS.tmp} untouched for an hour. Best effort: a file that cannot be removed stays.
     *
     * @return how many files were removed
     */
    public static int cleanStaleTemps(Path target) {
        Path abs = target.toAbsolutePath();
        Path dir = abs.getParent();
        if (dir == null || !Files.isDirectory(dir)) return 0;
        String name = abs.getFileName().toString();
        Pattern withPid = Pattern.compile("\\." + Pattern.quote(name) + "\\.(\\d+)\\.\\d+\\.tmp");
        Pattern legacy = Pattern.compile("\\." + Pattern.quote(name) + "\\.\\d+\\.tmp");
        long self = ProcessHandle.current().pid();
        int removed = 0;
        try (DirectoryStream<Path> files = Files.newDirectoryStream(dir, "." + globQuote(name) + ".*.tmp")) {
            for (Path f : files) {
                String n = f.getFileName().toString();
                Matcher m = withPid.matcher(n);
                boolean stale;
                if (m.matches()) {
                    long pid;
                    try {
                        pid = Long.parseLong(m.group(1));
                    } catch (NumberFormatException e) {
                        continue;
                    }
                    stale = pid != self && ProcessHandle.of(pid).map(ProcessHandle::isAlive).orElse(false) == Boolean.FALSE;
                } else if (legacy.matcher(n).matches()) {
                    stale = Files.getLastModifiedTime(f).toInstant().isBefore(Instant.now().minus(LEGACY_STALE_AGE));
                } else {
                    continue;
                }
                if (stale && Files.isRegularFile(f, java.nio.file.LinkOption.NOFOLLOW_LINKS) && Files.deleteIfExists(f)) removed++;
            }
        } catch (IOException | RuntimeException e) {
            // best effort: an unreadable folder is reported by the write itself
        }
        return removed;
    }

    private static String globQuote(String s) {
        StringBuilder sb = new StringBuilder();
        for (char c : s.toCharArray()) {
            if ("*?[]{}\\".indexOf(c) >= 0) sb.append('\\');
            sb.append(c);
        }
        return sb.toString();
    }
}
