package org.loopledger.display;

import org.loopledger.control.BiquadCoefficients;
import org.loopledger.control.CoefficientTable;
import org.loopledger.control.DriveTiming;
import org.loopledger.control.Filter;
import org.loopledger.control.FilterChain;
import org.loopledger.lti.Units;

import java.util.Locale;
import java.util.Objects;

/**
 * A filter chain as a drive needs it: each filter in words and, at a sample rate, its discrete
 * coefficients b0 b1 b2 a1 a2 (a0 = 1) with 15 significant digits, and the caution (someone types them
 * into a drive). Numbers are single words ({@code +1.234567890123450e-01}): no spaces and no styling, so
 * no client wraps one in the middle. Without a sample rate the table lists the filters and says how to
 * get the coefficients. Immutable.
 */
public final class FilterTable implements Displayable {
    private final FilterChain chain;
    private final CoefficientTable coefficients; // null without a sample rate

    private FilterTable(FilterChain chain, CoefficientTable coefficients) {
        this.chain = Objects.requireNonNull(chain, "filters (FilterChain.none() for none)");
        this.coefficients = coefficients;
    }

    /** The filters in words (no sample rate, so no coefficients). */
    public static FilterTable of(FilterChain chain) { return new FilterTable(chain, null); }

    /** The filters with their discrete coefficients at {@code sampleRateHz}. */
    public static FilterTable of(FilterChain chain, double sampleRateHz) { return new FilterTable(chain, chain.coefficientTable(sampleRateHz)); }

    /** The filters with their discrete coefficients at the drive's sample rate (a sampled timing). */
    public static FilterTable of(FilterChain chain, DriveTiming timing) {
        if (!timing.isSampled()) throw new IllegalArgumentException("a continuous drive timing has no sample rate; use DriveTiming.sampledAtHz(fs) or FilterTable.of(chain, fs)");
        return of(chain, timing.sampleRateHz());
    }

    /** A coefficient table already computed. */
    public static FilterTable of(CoefficientTable table) {
        return new FilterTable(new FilterChain(table.rows().stream().map(CoefficientTable.Row::filter).toList()), table);
    }

    /** A coefficient as the table shows it: 15 significant digits, sign always written, one word. */

    HtmlTable table() {
        if (coefficients == null) {
            HtmlTable t = HtmlTable.of("Filters on the current command (continuous; coefficients need a sample rate: FilterTable.of(filters, fs))",
                    "#", "Filter", "Tustin prewarp (Hz)");
            int i = 1;
            for (Filter f : chain.filters()) t.row(String.valueOf(i++), f.describe(), Figures.num(Units.radPerSToHz(f.prewarpRadPerS())));
            if (t.isEmpty()) t.row(Figures.NONE, "no filters", Figures.NONE);
            return t;
        }
        HtmlTable t = HtmlTable.of("Filter coefficients at " + Units.formatHz(coefficients.sampleRateHz())
                + " (Tustin prewarped at each filter's characteristic frequency; H(z) = (b0 + b1 z^-1 + b2 z^-2)/(1 + a1 z^-1 + a2 z^-2))",
                "#", "Filter", "b0", "b1", "b2", "a1", "a2");
        int i = 1;
        for (CoefficientTable.Row r : coefficients.rows()) {
            BiquadCoefficients c = r.coefficients();
            t.row(String.valueOf(i++), r.filter().describe(), Units.digits15(c.b0()), Units.digits15(c.b1()), Units.digits15(c.b2()), Units.digits15(c.a1()), Units.digits15(c.a2()));
        }
        if (t.isEmpty()) t.row(Figures.NONE, "no filters", "", "", "", "", "");
        return t;
    }

    private boolean typedIntoADrive() { return coefficients != null && !coefficients.rows().isEmpty(); }

    @Override public String toString() {
        return (table().toText() + (typedIntoADrive() ? "Caution: " + DriveCaution.TEXT : "")).stripTrailing();
    }

    @Override public MimeBundle toMimeBundle() {
        StringBuilder h = new StringBuilder("<div class=\"loopledger-filters\">");
        table().appendTo(h);
        if (typedIntoADrive()) h.append("<p><strong>Caution.</strong> ").append(HtmlEscape.escape(DriveCaution.TEXT)).append("</p>");
        return MimeBundle.builder(toString()).put(MimeBundle.TEXT_HTML, h.append("</div>").toString()).build();
    }
}
