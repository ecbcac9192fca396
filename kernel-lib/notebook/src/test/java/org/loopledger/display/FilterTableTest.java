package org.loopledger.display;

import org.jsoup.Jsoup;
import org.jsoup.nodes.Document;
import org.junit.jupiter.api.Test;
import org.loopledger.control.DriveTiming;
import org.loopledger.control.FilterChain;
import org.loopledger.control.Notch;

import java.util.List;

import static org.junit.jupiter.api.Assertions.*;

class FilterTableTest {
    @Test
    void notchCoefficientsMatchTheCookbookAndAreNeverBroken() {
        // Notch 1 kHz at 16 kHz with Q = 2 and full depth is the Audio EQ Cookbook notch (R. Bristow-Johnson, W3C Note 2021):
        // w0 = 2π·1000/16000, alpha = sin(w0)/(2Q); b = {1, -2cos w0, 1}/(1 + alpha), a1 = -2cos w0/(1 + alpha), a2 = (1 - alpha)/(1 + alpha).
        // Our notch has a finite depth, so use a depth deep enough (200 dB) that the residual is below the printed digits.
        FilterChain chain = FilterChain.of(Notch.ofHzAndQ(1000, 200, 2));
        MimeBundle b = FilterTable.of(chain, DriveTiming.sampledAtHz(16000)).toMimeBundle();
        String html = b.get(MimeBundle.TEXT_HTML).orElseThrow();
        MarginsTableTest.wellFormed(html);
        Document d = Jsoup.parse(html);
        List<String> r = d.select("tbody tr").get(0).select("td").eachText();
        double w0 = 2 * Math.PI / 16, alpha = Math.sin(w0) / 4, a0 = 1 + alpha;
        double[] expected = {1 / a0, -2 * Math.cos(w0) / a0, 1 / a0, -2 * Math.cos(w0) / a0, (1 - alpha) / a0};
        for (int i = 0; i < 5; i++) {
            // Tolerance: 1e-9 covers the 200 dB depth residual (1e-10) and the 15 printed digits.
            assertEquals(expected[i], Double.parseDouble(r.get(2 + i)), 1e-9, "coefficient " + i);
            assertFalse(r.get(2 + i).contains(" "), "a number is one word: " + r.get(2 + i));
        }
        assertFalse(html.contains("style="), "no styling that could break a number");
        assertTrue(d.text().contains(DriveCaution.TEXT));
        assertTrue(b.plainText().endsWith("Caution: " + DriveCaution.TEXT), b.plainText());
        assertEquals(b.plainText(), FilterTable.of(FilterChain.of(Notch.ofHzAndQ(1000, 200, 2)), 16000).toString(), "deterministic");
    }

    @Test
    void aChainWithoutASampleRateSaysHowToGetTheCoefficients() {
        MimeBundle b = Bundles.of(FilterChain.of(Notch.ofHz(450, 20, 90)));
        assertTrue(b.plainText().contains("FilterTable.of(filters, fs)"), b.plainText());
        assertFalse(b.plainText().contains("Caution"), "nothing to type in yet");
        assertThrows(IllegalArgumentException.class, () -> FilterTable.of(FilterChain.none(), DriveTiming.continuous()));
    }
}
