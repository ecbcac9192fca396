package org.loopledger.lti;

import org.apache.commons.math3.complex.Complex;
import org.junit.jupiter.api.function.Executable;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

import java.util.List;
import java.util.stream.Stream;

import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Bad input gives an IllegalArgumentException whose message names the problem (house rule: never a
 * silent NaN). Each row: what is wrong, the call, words the message must contain.
 */
class LtiBadInputTest {
    static final TransferFunction FIRST = TransferFunction.continuous(new double[] {1}, new double[] {1, 1});
    static final TransferFunction SAMPLED = TransferFunction.discrete(new double[] {1}, new double[] {1, -0.5}, 0.01);

    static Stream<Arguments> rows() {
        return Stream.of(
                Arguments.of("NaN coefficient", (Executable) () -> TransferFunction.continuous(new double[] {Double.NaN}, new double[] {1, 1}),
                        List.of("coefficient 0", "NaN", "finite")),
                Arguments.of("infinite coefficient", (Executable) () -> TransferFunction.continuous(new double[] {1}, new double[] {1, Double.POSITIVE_INFINITY}),
                        List.of("coefficient 1", "Infinity", "finite")),
                Arguments.of("no coefficients", (Executable) () -> Polynomial.ofDescending(),
                        List.of("at least one coefficient")),
                Arguments.of("zero denominator", (Executable) () -> TransferFunction.continuous(new double[] {1}, new double[] {0, 0}),
                        List.of("denominator", "zero polynomial")),
                Arguments.of("zoh of s + 1 (not proper)", (Executable) () -> Discretization.zoh(TransferFunction.continuous(new double[] {1, 1}, new double[] {1}), 0.01),
                        List.of("zero-order-hold", "proper", "degree 1")),
                Arguments.of("tustin of s (not proper)", (Executable) () -> Discretization.tustin(TransferFunction.s(), 0.01),
                        List.of("Tustin", "proper")),
                Arguments.of("matched of s² + 1 over s + 2 (not proper)", (Executable) () -> Discretization.matched(
                                TransferFunction.continuous(new double[] {1, 0, 1}, new double[] {1, 2}), 0.01, 1.0),
                        List.of("matched", "proper")),
                Arguments.of("zohStateSpace of a delayed system", (Executable) () -> Discretization.zohStateSpace(FIRST.withDelay(1e-3), 1e-3),
                        List.of("delay", "withoutDelay")),
                Arguments.of("zohStateSpace of a static gain", (Executable) () -> Discretization.zohStateSpace(TransferFunction.gain(2), 1e-3),
                        List.of("static gain", "no states")),
                Arguments.of("state-space response above Nyquist", (Executable) () -> Discretization.zohStateSpace(FIRST, 1e-3).response(4000.0),
                        List.of("Nyquist", "500 Hz")),
                Arguments.of("state-space response at a pole on the unit circle", (Executable) () ->
                                Discretization.zohStateSpace(TransferFunction.continuous(new double[] {1}, new double[] {1, 0}), 1e-3).response(0.0),
                        List.of("pole", "unit circle")),
                Arguments.of("series sections of s (not proper)", (Executable) () -> StateSpace.seriesSections(TransferFunction.s()),
                        List.of("state-space", "proper")),
                Arguments.of("state space of s (not proper)", (Executable) () -> StateSpace.controllableCanonical(TransferFunction.s()),
                        List.of("state-space", "proper")),
                Arguments.of("negative sample time", (Executable) () -> Discretization.zoh(FIRST, -1e-3),
                        List.of("sample time", "-0.001")),
                Arguments.of("NaN sample time", (Executable) () -> TransferFunction.discrete(new double[] {1}, new double[] {1}, Double.NaN),
                        List.of("sample time", "NaN")),
                Arguments.of("discretising a sampled system", (Executable) () -> Discretization.zoh(SAMPLED, 0.01),
                        List.of("already sampled")),
                Arguments.of("prewarp above Nyquist", (Executable) () -> Discretization.tustin(FIRST, 0.01, 400),
                        List.of("prewarp", "Nyquist")),
                Arguments.of("sampled response above Nyquist", (Executable) () -> SAMPLED.response(2 * Math.PI * 60),
                        List.of("above the Nyquist", "60 Hz", "50 Hz")),
                Arguments.of("response at a pole on the axis", (Executable) () -> TransferFunction.continuous(new double[] {1}, new double[] {1, 0}).response(0.0),
                        List.of("pole", "imaginary axis", "infinite")),
                Arguments.of("response at an undamped resonance", (Executable) () -> TransferFunction.continuous(new double[] {1}, new double[] {1, 0, 4}).response(2.0),
                        List.of("pole", "index 0")),
                Arguments.of("response at z = 1 of a sampled integrator", (Executable) () -> TransferFunction.discrete(new double[] {1}, new double[] {1, -1}, 0.01).response(0.0),
                        List.of("pole", "unit circle")),
                Arguments.of("NaN frequency", (Executable) () -> FIRST.response(Double.NaN),
                        List.of("frequency", "NaN", "not finite")),
                Arguments.of("output arrays too short", (Executable) () -> FIRST.response(new double[3], new double[2], new double[3]),
                        List.of("shorter", "3 points")),
                Arguments.of("negative delay", (Executable) () -> FIRST.withDelay(-1),
                        List.of("delay", "-1")),
                Arguments.of("inverse of a delay", (Executable) () -> FIRST.withDelay(0.1).inverse(),
                        List.of("inverse", "delay")),
                Arguments.of("inverse of zero", (Executable) () -> TransferFunction.gain(0).inverse(),
                        List.of("zero", "inverse")),
                Arguments.of("delay inside a loop", (Executable) () -> FIRST.withDelay(0.1).feedback(),
                        List.of("delay", "feedback", "Pade")),
                Arguments.of("ill-posed loop 1 + G = 0", (Executable) () -> TransferFunction.gain(-1).feedback(),
                        List.of("1 + G·H", "ill-posed")),
                Arguments.of("NaN cancellation tolerance", (Executable) () -> FIRST.minimal(Double.NaN),
                        List.of("tolerance", "NaN")),
                Arguments.of("roots of the zero polynomial", (Executable) () -> Polynomial.zero().roots(),
                        List.of("zero polynomial")),
                Arguments.of("non-conjugate complex roots", (Executable) () -> Polynomial.ofRoots(new Complex(1, 1)),
                        List.of("conjugate pairs")),
                Arguments.of("state space with mismatched B", (Executable) () -> StateSpace.of(new double[][] {{1, 0}, {0, 1}}, new double[] {1}, new double[] {1, 1}, 0, TimeBase.continuous()),
                        List.of("2x2", "B has 1")),
                Arguments.of("state space with a NaN in A", (Executable) () -> StateSpace.of(new double[][] {{1, 0}, {Double.NaN, 1}}, new double[] {1, 0}, new double[] {1, 1}, 0, TimeBase.continuous()),
                        List.of("A(1,0)", "NaN")),
                Arguments.of("state space with a ragged A", (Executable) () -> StateSpace.of(new double[][] {{1, 0}, {1}}, new double[] {1, 0}, new double[] {1, 1}, 0, TimeBase.continuous()),
                        List.of("square", "row 1")),
                Arguments.of("sample rate 0 Hz", (Executable) () -> TimeBase.sampledAtHz(0),
                        List.of("sample rate", "0.0")));
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("rows")
    void clearIllegalArgumentException(String what, Executable call, List<String> mustMention) {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, call, what);
        for (String word : mustMention) {
            assertTrue(e.getMessage().contains(word), what + ": message should mention '" + word + "': " + e.getMessage());
        }
    }
}
