package org.loopledger.ident.log;

import java.nio.ByteBuffer;
import java.nio.ByteOrder;
import java.nio.charset.StandardCharsets;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.zip.DataFormatException;
import java.util.zip.Inflater;

/**
 * The variables of a Level 5 {@code .mat} file, read by its published layout: a 128-byte header (116 bytes of text,
 * an 8-byte subsystem offset, the version 0x0100 and the endian indicator "IM" or "MI"), then tagged data elements
 * (type and byte count, or both packed into 4 bytes for a small element; data padded to 8 bytes), each variable an
 * array element (flags with the class, dimensions, name, then the data) or a zlib-compressed element holding one.
 * Numeric data of any stored integer or floating type becomes {@code double}; character arrays become text; a 1×1
 * struct gives its fields; cells, objects, sparse and function arrays are named but not read. The header itself is
 * checked by {@link MatLogReader} first.
 */
final class Level5Mat {
    private Level5Mat() {}

    /** A variable: a real or complex numeric array, text, a struct, or a kind this reader names but does not read. */
    sealed interface Value permits Numeric, Text, Fields, Other {
        int[] dims();

        default int elements() {
            int n = 1;
            for (int d : dims()) n *= d;
            return n;
        }

        default String dimsText() {
            StringBuilder sb = new StringBuilder();
            for (int d : dims()) sb.append(sb.length() == 0 ? "" : "×").append(d);
            return sb.toString();
        }
    }

    /** A numeric array, column-major; for a complex one only the real part is kept. */
    record Numeric(int[] dims, double[] real, boolean complex) implements Value {}

    record Text(int[] dims, String text) implements Value {}

    /** A struct; its fields (in file order) only when it has exactly one element. */
    record Fields(int[] dims, Map<String, Value> fields) implements Value {}

    record Other(int[] dims, String kind) implements Value {}

    // data types (the format's "mi" codes) and array classes (its "mx" codes)
    private static final int INT8 = 1, UINT8 = 2, INT16 = 3, UINT16 = 4, INT32 = 5, UINT32 = 6, SINGLE = 7, DOUBLE = 9,
            INT64 = 12, UINT64 = 13, MATRIX = 14, COMPRESSED = 15, UTF8 = 16, UTF16 = 17, UTF32 = 18;
    private static final int CLASS_CELL = 1, CLASS_STRUCT = 2, CLASS_OBJECT = 3, CLASS_CHAR = 4, CLASS_SPARSE = 5;
    private static final int COMPLEX_FLAG = 0x0800;

    private record Element(int type, ByteBuffer data) {}

    /** The top-level variables in file order. {@code bytes} is the whole file, its header already checked. */
    static Map<String, Value> variables(byte[] bytes) {
        ByteOrder order = bytes[126] == 'I' ? ByteOrder.LITTLE_ENDIAN : ByteOrder.BIG_ENDIAN;
        ByteBuffer b = ByteBuffer.wrap(bytes).order(order);
        b.position(128);
        Map<String, Value> out = new LinkedHashMap<>();
        while (b.remaining() >= 8) {
            Element e = next(b);
            if (e.type() == COMPRESSED) e = next(inflate(e.data()));
            if (e.type() != MATRIX) continue; // other top-level elements carry no variable
            String[] name = new String[1];
            Value v = array(e.data(), name);
            out.put(name[0], v);
        }
        return out;
    }

    private static Element next(ByteBuffer b) {
        int first = b.getInt();
        if ((first >>> 16) != 0) { // small element: byte count in the upper half, type in the lower, data in the next 4 bytes
            int n = first >>> 16;
            if (n > 4) throw new IllegalArgumentException("a small data element claims " + n + " bytes (at most 4)");
            ByteBuffer d = slice(b, b.position(), n);
            b.position(b.position() + 4);
            return new Element(first & 0xffff, d);
        }
        int n = b.getInt();
        if (n < 0 || n > b.remaining()) {
            throw new IllegalArgumentException("a data element claims " + Integer.toUnsignedString(n) + " bytes but " + b.remaining() + " remain (truncated file?)");
        }
        ByteBuffer d = slice(b, b.position(), n);
        int padded = first == COMPRESSED ? n : (n + 7) & ~7; // compressed elements are not padded
        b.position(Math.min(b.limit(), b.position() + padded));
        return new Element(first, d);
    }

    private static ByteBuffer slice(ByteBuffer b, int from, int length) {
        return b.duplicate().position(from).limit(from + length).slice().order(b.order());
    }

    private static ByteBuffer inflate(ByteBuffer compressed) {
        byte[] in = new byte[compressed.remaining()];
        compressed.get(in);
        Inflater inflater = new Inflater();
        try {
            inflater.setInput(in);
            java.io.ByteArrayOutputStream out = new java.io.ByteArrayOutputStream(Math.max(64, in.length * 4));
            byte[] buf = new byte[1 << 16];
            while (!inflater.finished()) {
                int k = inflater.inflate(buf);
                if (k == 0 && (inflater.needsInput() || inflater.needsDictionary())) {
                    throw new IllegalArgumentException("a compressed element ends early (truncated file?)");
                }
                out.write(buf, 0, k);
            }
            return ByteBuffer.wrap(out.toByteArray()).order(compressed.order());
        } catch (DataFormatException e) {
            throw new IllegalArgumentException("a compressed element is not valid zlib data: " + e.getMessage(), e);
        } finally {
            inflater.end();
        }
    }

    /** One array element's content; its name goes to {@code name[0]}. */
    private static Value array(ByteBuffer d, String[] name) {
        if (!d.hasRemaining()) { // an empty array (e.g. an unset struct field)
            name[0] = "";
            return new Other(new int[] {0, 0}, "empty");
        }
        ByteBuffer flagsData = next(d).data();
        int flags = flagsData.getInt(0), cls = flags & 0xff;
        ByteBuffer dimsData = next(d).data();
        int[] dims = new int[dimsData.remaining() / 4];
        for (int i = 0; i < dims.length; i++) dims[i] = dimsData.getInt(4 * i);
        name[0] = text(next(d), UTF8);
        if (cls >= 6 && cls <= 15) {
            boolean complex = (flags & COMPLEX_FLAG) != 0;
            double[] real = numbers(next(d));
            Numeric n = new Numeric(dims, real, complex);
            if (real.length != n.elements()) {
                throw new IllegalArgumentException("variable '" + name[0] + "' holds " + real.length + " values for dimensions " + n.dimsText());
            }
            return n;
        }
        if (cls == CLASS_CHAR) return new Text(dims, d.remaining() >= 8 ? text(next(d), UTF8) : "");
        if (cls == CLASS_STRUCT) {
            int length = next(d).data().getInt(0);
            ByteBuffer namesData = next(d).data();
            String[] fields = new String[length == 0 ? 0 : namesData.remaining() / length];
            for (int f = 0; f < fields.length; f++) {
                byte[] raw = new byte[length];
                namesData.get(f * length, raw);
                int end = 0;
                while (end < raw.length && raw[end] != 0) end++;
                fields[f] = new String(raw, 0, end, StandardCharsets.UTF_8);
            }
            Fields s = new Fields(dims, new LinkedHashMap<>());
            if (s.elements() == 1) {
                String[] ignored = new String[1];
                for (String f : fields) s.fields().put(f, array(next(d).data(), ignored));
            }
            return s;
        }
        return new Other(dims, switch (cls) {
            case CLASS_CELL -> "cell array";
            case CLASS_OBJECT -> "object";
            case CLASS_SPARSE -> "sparse array";
            default -> "array of class " + cls;
        });
    }

    private static double[] numbers(Element e) {
        ByteBuffer b = e.data();
        int size = switch (e.type()) {
            case INT8, UINT8 -> 1;
            case INT16, UINT16 -> 2;
            case INT32, UINT32, SINGLE -> 4;
            case DOUBLE, INT64, UINT64 -> 8;
            default -> throw new IllegalArgumentException("numeric data stored as data type " + e.type() + ", which is not a number type");
        };
        double[] v = new double[b.remaining() / size];
        for (int i = 0; i < v.length; i++) {
            int at = i * size;
            v[i] = switch (e.type()) {
                case INT8 -> b.get(at);
                case UINT8 -> b.get(at) & 0xff;
                case INT16 -> b.getShort(at);
                case UINT16 -> b.getShort(at) & 0xffff;
                case INT32 -> b.getInt(at);
                case UINT32 -> b.getInt(at) & 0xffffffffL;
                case SINGLE -> b.getFloat(at);
                case DOUBLE -> b.getDouble(at);
                case INT64 -> b.getLong(at);
                default -> unsignedLongToDouble(b.getLong(at));
            };
        }
        return v;
    }

    private static double unsignedLongToDouble(long x) {
        return x >= 0 ? x : ((x >>> 1) | (x & 1)) * 2.0;
    }

    private static String text(Element e, int defaultType) {
        ByteBuffer b = e.data();
        byte[] raw = new byte[b.remaining()];
        b.duplicate().get(raw);
        int type = e.type() == 0 ? defaultType : e.type();
        return switch (type) {
            case UINT16, UTF16 -> new String(raw, b.order() == ByteOrder.LITTLE_ENDIAN ? StandardCharsets.UTF_16LE : StandardCharsets.UTF_16BE);
            case UTF32 -> new String(raw, java.nio.charset.Charset.forName(b.order() == ByteOrder.LITTLE_ENDIAN ? "UTF-32LE" : "UTF-32BE"));
            default -> new String(raw, StandardCharsets.UTF_8);
        };
    }
}
