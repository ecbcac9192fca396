package org.loopledger.ident.log;

import org.loopledger.provenance.Provenance;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;

/**
 * Reads a drive log from a Level 5 {@code .mat} file (versions 6 and 7, as SciPy's {@code savemat} writes them,
 * compressed or not) with our own reader of the published layout ({@link Level5Mat}). Each channel is a real
 * numeric vector (N×1 or 1×N), either a top-level variable or a field of a 1×1 struct, named by the
 * header convention of {@link LogColumns} or mapped by a {@link ColumnMap} (by variable or field name).
 * Scalars and strings become metadata (a scalar {@code sample_rate_Hz} states the rate). Then the same
 * units, time base and checks as {@link DriveLogReader}. Version 7.3 files (HDF5) are refused with the fix.
 */
public final class MatLogReader {
    private MatLogReader() {}

    public static DriveLog read(Path file, ColumnMap map, LogCheckOptions o) throws IOException {
        String source = file.toString();
        checkHeader(file);
        List<String> names = new ArrayList<>();
        List<double[]> cols = new ArrayList<>();
        Map<String, String> meta = new LinkedHashMap<>();
        Map<String, Level5Mat.Value> variables;
        try {
            variables = Level5Mat.variables(Files.readAllBytes(file));
        } catch (RuntimeException e) {
            throw new IllegalArgumentException(source + ": cannot read as a Level 5 .mat file (" + e.getMessage()
                    + "); save it as a version 6/7 file (-v7) or with scipy.io.savemat", e);
        }
        variables.forEach((name, v) -> collect(source, name, v, names, cols, meta, true));
        if (names.isEmpty()) {
            throw new IllegalArgumentException(source + ": no numeric vectors in the file (variables: " + meta.keySet()
                    + "); save each channel as a vector, e.g. scipy.io.savemat(f, {'time_s': t, 'velocity_rad_s': v})");
        }
        int n = cols.get(0).length;
        for (int i = 1; i < cols.size(); i++) {
            if (cols.get(i).length != n) {
                throw new IllegalArgumentException(String.format(Locale.ROOT, "%s: variable '%s' has %d samples but '%s' has %d; every channel of a log needs the same length",
                        source, names.get(i), cols.get(i).length, names.get(0), n));
            }
        }
        Provenance.Dataset d = Provenance.recordDataset(file);
        return DriveLogReader.assemble(source, n, names.toArray(String[]::new), cols.toArray(double[][]::new), null, 0, 0, meta, map, o, d);
    }

    /**
     * Checks the 128-byte header of a Level 5 .mat file by its structure, not its free text: bytes 124-125 hold the
     * version (0x0100 for Level 5, 0x0200 for the HDF5-based version 7.3), bytes 126-127 the endian indicator "IM"
     * (little-endian) or "MI" (big-endian).
     */
    private static void checkHeader(Path file) throws IOException {
        byte[] head = new byte[128];
        int r;
        try (var in = Files.newInputStream(file)) {
            r = in.readNBytes(head, 0, 128);
        }
        boolean little = r == 128 && head[126] == 'I' && head[127] == 'M';
        boolean big = r == 128 && head[126] == 'M' && head[127] == 'I';
        if (!little && !big) {
            throw new IllegalArgumentException(file + ": not a Level 5 .mat file (no endian indicator in its 128-byte header; a version 4 file "
                    + "or another format); save it as a version 6/7 .mat file (-v7) or with scipy.io.savemat");
        }
        int version = little ? (head[124] & 0xff) | (head[125] & 0xff) << 8 : (head[125] & 0xff) | (head[124] & 0xff) << 8;
        if (version == 0x0200) {
            throw new IllegalArgumentException(file + ": a version 7.3 (HDF5) .mat file, which this reader does not read; save it as a version 7 file (-v7) or with scipy.io.savemat");
        }
        if (version != 0x0100) {
            throw new IllegalArgumentException(file + ": a .mat file of unknown version 0x" + Integer.toHexString(version)
                    + "; save it as a version 6/7 .mat file (-v7) or with scipy.io.savemat");
        }
    }

    private static void collect(String source, String name, Level5Mat.Value a, List<String> names, List<double[]> cols, Map<String, String> meta, boolean top) {
        if (a instanceof Level5Mat.Fields s) {
            if (!top || s.elements() != 1) {
                throw new IllegalArgumentException(source + ": variable '" + name + "' is a " + s.dimsText() + " struct; only a 1×1 struct of channel vectors at the top level is read");
            }
            s.fields().forEach((f, v) -> collect(source, f, v, names, cols, meta, false));
        } else if (a instanceof Level5Mat.Text c) {
            meta.put(name, c.text());
        } else if (a instanceof Level5Mat.Numeric m) {
            if (m.complex()) throw new IllegalArgumentException(source + ": variable '" + name + "' is complex; a log channel is real");
            int[] dims = m.dims();
            int n = m.elements();
            if (n == 1) {
                meta.put(name, LogUnit.fmt(m.real()[0]));
                return;
            }
            if (dims.length != 2 || (dims[0] != 1 && dims[1] != 1)) {
                throw new IllegalArgumentException(source + ": variable '" + name + "' is a " + m.dimsText() + " matrix; save each channel as its own vector "
                        + "(or a struct of vectors) so every column has a name");
            }
            names.add(name);
            cols.add(m.real());
        } else if (a instanceof Level5Mat.Other o) {
            meta.put(name, "(" + o.kind() + " " + o.dimsText() + ", not read)");
        }
    }
}
