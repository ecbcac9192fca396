package org.loopledger.kernel;

/** Cursor positions: the messaging specification (5.2 and later) counts Unicode code points; Java strings count UTF-16 units. */
final class CodePoints {
    private CodePoints() {}

    static int toUtf16(String s, int codePoints) {
        int n = Math.max(0, Math.min(codePoints, s.codePointCount(0, s.length())));
        return s.offsetByCodePoints(0, n);
    }

    static int fromUtf16(String s, int index) {
        return s.codePointCount(0, Math.max(0, Math.min(index, s.length())));
    }
}
