package org.loopledger.notebook;

import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.channels.FileChannel;
import java.nio.charset.StandardCharsets;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.nio.file.StandardOpenOption;

/**
 * Atomic file replacement: the content goes to a temporary file in the same folder, is forced to
 * disk, then renamed over the target. A reader sees the old file or the new one, never half of one.
 */
public final class AtomicFiles {
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

    public static void writeBytes(Path target, byte[] content) {
        Path abs = target.toAbsolutePath();
        Path dir = abs.getParent();
        if (dir == null || !Files.isDirectory(dir)) {
            throw new IllegalArgumentException("cannot write " + target + ": the folder " + dir + " does not exist; create it first or choose another output path");
        }
        Path tmp = null;
        try {
            tmp = Files.createTempFile(dir, "." + abs.getFileName() + ".", ".tmp");
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
            throw new IllegalArgumentException("cannot write " + target + ": " + e.getMessage(), e);
        } finally {
            if (tmp != null) {
                try { Files.deleteIfExists(tmp); } catch (IOException ignored) { /* best effort clean-up */ }
            }
        }
    }
}
