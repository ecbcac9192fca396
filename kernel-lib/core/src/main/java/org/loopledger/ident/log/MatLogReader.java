package org.loopledger.ident.log;

import org.loopledger.provenance.Provenance;
import us.hebi.matlab.mat.format.Mat5;
import us.hebi.matlab.mat.format.Mat5File;
import us.hebi.matlab.mat.types.Array;
import us.hebi.matlab.mat.types.Char;
import us.hebi.matlab.mat.types.MatFile;
import us.hebi.matlab.mat.types.Matrix;
import us.hebi.matlab.mat.types.Struct;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;

/**
 * Reads a drive log from a Level 5 {@code .mat} file (MAT-file versions 6 and 7, as written by {@code save -v6} /
 * {@code -v7} or SciPy's {@code savemat}) through the MAT File Library (mfl-core). Each channel is a real
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
        Mat5File mat;
        try {
            mat = Mat5.readFromFile(file.toFile());
        } catch (RuntimeException e) {
            throw new IllegalArgumentException(source + ": cannot read as a Level 5 .mat file (" + e.getMessage()
                    + "); save it with save(..., '-v7') or scipy.io.savemat", e);
        }
        try (MatFile m = mat) {
            for (MatFile.Entry e : m.getEntries()) collect(source, e.getName(), e.getValue(), names, cols, meta, true);
        }
        if (names.isEmpty()) {
            throw new IllegalArgumentException(source + ": no numeric vectors in the file (variables: " + meta.keySet()
                    + "); save each channel as a vector, e.g. savemat(f, {'time_s': t, 'velocity_rad_s': v})");
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
     * Checks the 128-byte header of a Level 5 MAT-file by its structure, not its free text: bytes 124-125 hold the
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
                    + "or another format); save it as a version 6/7 MAT-file (save(f, ..., '-v7')) or with scipy.io.savemat");
        }
        int version = little ? (head[124] & 0xff) | (head[125] & 0xff) << 8 : (head[125] & 0xff) | (head[124] & 0xff) << 8;
        if (version == 0x0200) {
            throw new IllegalArgumentException(file + ": a version 7.3 (HDF5) .mat file, which this reader does not read; save it with save(f, ..., '-v7')");
        }
        if (version != 0x0100) {
            throw new IllegalArgumentException(file + ": a .mat file of unknown version 0x" + Integer.toHexString(version)
                    + "; save it as a version 6/7 MAT-file (save(f, ..., '-v7')) or with scipy.io.savemat");
        }
    }

    private static void collect(String source, String name, Array a, List<String> names, List<double[]> cols, Map<String, String> meta, boolean top) {
        if (a instanceof Struct s) {
            if (!top || s.getNumElements() != 1) {
                throw new IllegalArgumentException(source + ": variable '" + name + "' is a " + dims(a) + " struct; only a 1×1 struct of channel vectors at the top level is read");
            }
            for (String f : s.getFieldNames()) collect(source, f, s.get(f), names, cols, meta, false);
        } else if (a instanceof Char c) {
            meta.put(name, c.getString());
        } else if (a instanceof Matrix m) {
            if (m.isComplex()) throw new IllegalArgumentException(source + ": variable '" + name + "' is complex; a log channel is real");
            int[] dims = m.getDimensions();
            int n = m.getNumElements();
            if (n == 1) {
                meta.put(name, LogUnit.fmt(m.getDouble(0)));
                return;
            }
            if (dims.length != 2 || (dims[0] != 1 && dims[1] != 1)) {
                throw new IllegalArgumentException(source + ": variable '" + name + "' is a " + dims(a) + " matrix; save each channel as its own vector "
                        + "(or a struct of vectors) so every column has a name");
            }
            double[] v = new double[n];
            for (int i = 0; i < n; i++) v[i] = m.getDouble(i);
            names.add(name);
            cols.add(v);
        } else {
            meta.put(name, "(" + a.getType() + " " + dims(a) + ", not read)");
        }
    }

    private static String dims(Array a) {
        StringBuilder sb = new StringBuilder();
        for (int d : a.getDimensions()) sb.append(sb.length() == 0 ? "" : "×").append(d);
        return sb.toString();
    }
}
