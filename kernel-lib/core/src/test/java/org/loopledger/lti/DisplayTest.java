package org.loopledger.lti;

import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

import java.util.stream.Stream;

import static org.junit.jupiter.api.Assertions.assertEquals;

/** Plain-text forms of transfer functions (display contract; expected strings written by hand). LaTeX lives in display.Latex only. */
class DisplayTest {
    static TransferFunction tf(double[] n, double[] d) { return TransferFunction.continuous(n, d); }

    static Stream<Arguments> forms() {
        return Stream.of(
                Arguments.of(tf(new double[] {1, 1}, new double[] {1, 3, 2}),
                        "(s + 1) / (s^2 + 3 s + 2)"),
                Arguments.of(tf(new double[] {-2}, new double[] {1, 0}),
                        "(-2) / (s)"),
                Arguments.of(tf(new double[] {4, 0}, new double[] {1}),
                        "(4 s)"),
                Arguments.of(tf(new double[] {10}, new double[] {1, 10}).withDelay(0.001),
                        "(10) / (s + 10) · e^(-0.001 s)"),
                Arguments.of(tf(new double[] {1}, new double[] {1, 0, 0}).withDelay(2.5e-5),
                        "(1) / (s^2) · e^(-2.5e-05 s)"),
                Arguments.of(TransferFunction.discrete(new double[] {1.953125e-9, 1.953125e-9}, new double[] {1, -2, 1}, 6.25e-5),
                        "(1.953e-09 z + 1.953e-09) / (z^2 - 2 z + 1)   [T = 6.25e-05 s]"),
                Arguments.of(TransferFunction.discrete(new double[] {0.5}, new double[] {1, -0.5}, 0.001).withDelay(0.0015),
                        "(0.5) / (z - 0.5) · e^(-0.0015 s)   [T = 0.001 s]"));
    }

    @ParameterizedTest(name = "{1}")
    @MethodSource("forms")
    void readableText(TransferFunction g, String text) {
        assertEquals(text, g.toString());
    }
}
