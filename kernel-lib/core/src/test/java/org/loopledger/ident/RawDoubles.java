package org.loopledger.ident;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.ByteBuffer;
import java.nio.ByteOrder;
import java.nio.channels.FileChannel;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;

/** Test helper: hands big arrays to the Python oracle as raw little-endian doubles ({@code numpy.fromfile(path, '<f8')}). */
public final class RawDoubles {
    private RawDoubles() {}

    public static Path write(double[]... arrays) {
        try {
            Path p = Files.createTempFile("loopledger-oracle", ".f8");
            p.toFile().deleteOnExit();
            try (FileChannel ch = FileChannel.open(p, StandardOpenOption.WRITE, StandardOpenOption.TRUNCATE_EXISTING)) {
                for (double[] a : arrays) {
                    ByteBuffer b = ByteBuffer.allocate(a.length * 8).order(ByteOrder.LITTLE_ENDIAN);
                    b.asDoubleBuffer().put(a);
                    ch.write(b);
                }
            }
            return p;
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }
}
