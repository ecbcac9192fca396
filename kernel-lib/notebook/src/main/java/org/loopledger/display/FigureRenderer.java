package org.loopledger.display;

import com.google.gson.Gson;
import org.knowm.xchart.XYChart;
import org.knowm.xchart.XYSeries;
import org.loopledger.plot.Figure;

import java.awt.image.BufferedImage;
import java.io.IOException;
import java.util.Base64;

/**
 * A {@link Figure} as a notebook output: a PNG and the data its series draw under {@value #PLOT_DATA_MIME}
 * (so that {@code verify} compares plots through their data, not their pixels), plus one line of text.
 * Deterministic: the same figure gives the same bytes.
 *
 * <p>No {@code image/svg+xml} in the bundle, on purpose: a PNG shows everywhere a notebook is read
 * (Jupyter trusted and untrusted, where SVG counts as unsafe; GitHub and other viewers; and
 * {@code jupyter nbconvert --to html} 6.5 as Debian ships it, whose {@code clean_html} filter strips every
 * element inside an {@code <svg>} and so shows each SVG plot blank), while an SVG beside it would be
 * chosen first by nbconvert and blank the plot there, and would store the figure a third time. The compact
 * vector form is {@link Figure#svg()}, for export.
 */
public final class FigureRenderer {
    /**
     * MIME type of the plotted data: JSON {@code {"title", "note" (only when the figure has one), "panels": [{"title", "x_axis", "y_axis",
     * "series": [{"name", "x", "y"}]}]}}, where {@code x} and {@code y} are strings of numbers separated by
     * spaces. Strings, not JSON arrays, because notebook files are written indented, one array element a
     * line (nbformat does so too): a number array grows about threefold there, a string stays one line.
     */
    public static final String PLOT_DATA_MIME = "application/vnd.loopledger.plot-data+json";

    /**
     * Significant digits of the stored plot data: {@code verify}'s default relative tolerance is 1e-6, and
     * a value rounded to 7 digits moves by at most half a unit in the 7th digit (under 5e-7 relative), so
     * rounding never turns agreement into a difference, and no plot shows a difference that small.
     */
    static final int PLOT_DATA_DIGITS = 7;

    private static final Gson GSON = new Gson();

    private FigureRenderer() {}

    public static MimeBundle render(Figure f) throws IOException {
        return MimeBundle.builder(f.toString())
                .put(MimeBundle.IMAGE_PNG, Base64.getEncoder().encodeToString(png(f)))
                .put(PLOT_DATA_MIME, plotData(f))
                .build();
    }

    /** The figure as compact SVG (see {@link Figure#svg()}), for export; not part of the notebook output. */
    public static String svg(Figure f) {
        return f.svg();
    }

    public static byte[] png(Figure f) throws IOException {
        return png(f.toImage(1.0));
    }

    /**
     * A palette PNG ({@link PaletteImage}: at most 256 colours, about half the bytes of RGB) written by
     * {@link IndexedPng} (filter None, deflate level 8: plots are flat colour). The JDK's writer at its strongest
     * setting tried every filter on every row: 16-19 ms of a Bode figure's 40 ms, for a file a fifth larger than
     * ours at level 9 (17.1 against 13.8 KB, a Bode figure of three integrator curves).
     */
    static byte[] png(BufferedImage img) throws IOException {
        return IndexedPng.encode(PaletteImage.of(img));
    }

    /** The series each panel draws, as JSON text, numbers to {@value #PLOT_DATA_DIGITS} significant digits. */
    public static String plotData(Figure f) {
        StringBuilder b = new StringBuilder(16 * 1024);
        b.append("{\"title\":").append(GSON.toJson(f.title()));
        if (!f.note().isEmpty()) b.append(",\"note\":").append(GSON.toJson(f.note()));
        b.append(",\"panels\":[");
        boolean firstPanel = true;
        for (XYChart c : f.panels()) {
            if (!firstPanel) b.append(',');
            firstPanel = false;
            b.append("{\"title\":").append(GSON.toJson(nz(c.getTitle()))).append(",\"x_axis\":").append(GSON.toJson(nz(c.getXAxisTitle())))
                    .append(",\"y_axis\":").append(GSON.toJson(nz(c.getYAxisTitle()))).append(",\"series\":[");
            boolean firstSeries = true;
            for (XYSeries s : c.getSeriesMap().values()) {
                if (!firstSeries) b.append(',');
                firstSeries = false;
                b.append("{\"name\":").append(GSON.toJson(s.getName())).append(",\"x\":");
                array(b, s.getXData());
                b.append(",\"y\":");
                array(b, s.getYData());
                b.append('}');
            }
            b.append("]}");
        }
        return b.append("]}").toString();
    }

    private static String nz(String s) { return s == null ? "" : s; }

    private static void array(StringBuilder b, double[] v) {
        b.append('"');
        for (int i = 0; i < v.length; i++) {
            if (i > 0) b.append(' ');
            b.append(rounded(v[i]));
        }
        b.append('"');
    }

    /** {@code v} to {@value #PLOT_DATA_DIGITS} significant digits, shortest form; 0 for a non-finite value (JSON has none). */
    static String rounded(double v) {
        if (!Double.isFinite(v) || v == 0) return "0";
        double a = Math.abs(v);
        int e = (int) Math.floor(Math.log10(a));
        long m = Math.round(a * Math.pow(10, PLOT_DATA_DIGITS - 1 - e));
        if (m >= 10_000_000L) { m = Math.round(m / 10.0); e++; }
        else if (m < 1_000_000L) { e--; m = Math.round(a * Math.pow(10, PLOT_DATA_DIGITS - 1 - e)); }
        int scale = PLOT_DATA_DIGITS - 1 - e; // value = m * 10^-scale
        while (scale > 0 && m % 10 == 0) { m /= 10; scale--; }
        StringBuilder b = new StringBuilder(16);
        if (v < 0) b.append('-');
        String digits = Long.toString(m);
        if (e < -5 || e >= 10) {
            b.append(digits.charAt(0));
            if (digits.length() > 1) b.append('.').append(digits, 1, digits.length());
            return b.append('e').append(e).toString();
        }
        if (scale <= 0) {
            b.append(digits);
            for (int i = 0; i < -scale; i++) b.append('0');
        } else if (scale >= digits.length()) {
            b.append("0.");
            for (int i = digits.length(); i < scale; i++) b.append('0');
            b.append(digits);
        } else {
            b.append(digits, 0, digits.length() - scale).append('.').append(digits, digits.length() - scale, digits.length());
        }
        return b.toString();
    }
}
