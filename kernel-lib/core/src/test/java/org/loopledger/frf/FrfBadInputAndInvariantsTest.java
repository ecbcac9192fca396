package org.loopledger.frf;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.function.Executable;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import org.loopledger.lti.TransferFunction;

import java.util.List;
import java.util.stream.Stream;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Bad input to the FRF value (each a clear IllegalArgumentException naming the problem) and EJML-style
 * invariants: inputs not modified, outputs are copies.
 */
class FrfBadInputAndInvariantsTest {
    static final double[] W = {1, 2, 3};
    static final double[] ONES = {1, 1, 1};
    static final Frf F = Frf.ofParts(W, ONES, new double[3]);

    static Stream<Arguments> rows() {
        return Stream.of(
                Arguments.of("grid not increasing", (Executable) () -> Frf.ofParts(new double[] {1, 3, 2}, ONES, ONES),
                        List.of("strictly increasing", "index 2")),
                Arguments.of("duplicate frequency", (Executable) () -> Frf.ofParts(new double[] {1, 2, 2}, ONES, ONES),
                        List.of("strictly increasing", "drop duplicates")),
                Arguments.of("mismatched lengths", (Executable) () -> Frf.ofParts(W, new double[] {1, 1}, ONES),
                        List.of("different lengths", "3 frequencies", "2 real parts")),
                Arguments.of("empty grid", (Executable) () -> Frf.ofParts(new double[0], new double[0], new double[0]),
                        List.of("at least one frequency")),
                Arguments.of("null grid", (Executable) () -> Frf.ofParts(null, ONES, ONES),
                        List.of("at least one frequency")),
                Arguments.of("zero frequency", (Executable) () -> Frf.ofParts(new double[] {0, 1, 2}, ONES, ONES),
                        List.of("index 0", "finite and positive")),
                Arguments.of("NaN frequency", (Executable) () -> Frf.ofParts(new double[] {1, Double.NaN, 2}, ONES, ONES),
                        List.of("index 1", "NaN")),
                Arguments.of("NaN value", (Executable) () -> Frf.ofParts(W, new double[] {1, Double.NaN, 1}, ONES),
                        List.of("index 1", "not finite")),
                Arguments.of("empty grid for a model", (Executable) () -> Frf.ofModel(TransferFunction.gain(1), new double[0]),
                        List.of("at least one frequency")),
                Arguments.of("coherence above 1", (Executable) () -> F.withCoherence(new double[] {0.5, 1.2, 0.5}),
                        List.of("coherence", "index 1", "[0, 1]")),
                Arguments.of("coherence of wrong length", (Executable) () -> F.withCoherence(new double[] {0.5}),
                        List.of("coherence", "1 values", "3 frequencies")),
                Arguments.of("negative uncertainty", (Executable) () -> F.withUncertainty(new double[] {0, -1, 0}),
                        List.of("uncertainty", "index 1")),
                Arguments.of("infinite scale", (Executable) () -> F.times(Double.POSITIVE_INFINITY),
                        List.of("scale factor", "finite")),
                Arguments.of("inverse of a zero value", (Executable) () -> Frf.ofParts(W, new double[] {1, 0, 1}, new double[3]).inverse(),
                        List.of("zero", "no inverse")),
                Arguments.of("dividing by a model that is zero there", (Executable) () -> F.dividedBy(TransferFunction.continuous(new double[] {1, 0, 4}, new double[] {1, 1})),
                        List.of("zero")),
                Arguments.of("log grid with low >= high", (Executable) () -> FrequencyGrid.logRadPerS(10, 10, 5),
                        List.of("0 < low < high")),
                Arguments.of("log grid of one point", (Executable) () -> FrequencyGrid.logSpacedRadPerS(1, 10, 1),
                        List.of("at least 2 points")),
                Arguments.of("Hz log grid with low >= high", (Executable) () -> FrequencyGrid.logSpacedHz(10, 1, 5),
                        List.of("0 < low < high", "Hz")),
                Arguments.of("Hz log grid of one point", (Executable) () -> FrequencyGrid.logSpacedHz(1, 10, 1),
                        List.of("at least 2 points")),
                Arguments.of("unwrapping a NaN phase", (Executable) () -> Phase.unwrapRad(new double[] {0, Double.NaN}),
                        List.of("index 1", "NaN", "finite")),
                Arguments.of("angle of mismatched parts", (Executable) () -> Phase.angleRad(new double[2], new double[3]),
                        List.of("different lengths")));
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("rows")
    void clearIllegalArgumentException(String what, Executable call, List<String> mustMention) {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, call, what);
        for (String word : mustMention) {
            assertTrue(e.getMessage().contains(word), what + ": message should mention '" + word + "': " + e.getMessage());
        }
    }

    @Test
    void inputsAreCopiedAndOutputsAreCopies() {
        double[] w = {1, 2, 3}, re = {1, 2, 3}, im = {0, -1, -2}, coh = {0.9, 0.8, 0.7};
        Frf f = Frf.ofParts(w, re, im).withCoherence(coh);
        w[0] = 0.5; re[0] = 99; im[0] = 99; coh[0] = 0;
        assertEquals(1.0, f.omegaAt(0));
        assertEquals(1.0, f.realAt(0));
        assertEquals(0.0, f.imagAt(0));
        assertEquals(0.9, f.coherence().orElseThrow()[0]);
        f.omegaRadPerS()[1] = -5;
        f.real()[1] = -5;
        f.imag()[1] = -5;
        f.coherence().orElseThrow()[1] = -5;
        assertArrayEquals(new double[] {1, 2, 3}, f.omegaRadPerS());
        assertArrayEquals(new double[] {1, 2, 3}, f.real());
        assertArrayEquals(new double[] {0, -1, -2}, f.imag());
        assertArrayEquals(new double[] {0.9, 0.8, 0.7}, f.coherence().orElseThrow());
    }

    @Test
    void operationsLeaveTheirArgumentsAlone() {
        Frf f = Frf.ofModel(TransferFunction.continuous(new double[] {1}, new double[] {1, 1}), FrequencyGrid.logRadPerS(1, 10, 5));
        Frf copy = Frf.ofParts(f.omegaRadPerS(), f.real(), f.imag());
        double[] target = FrequencyGrid.logRadPerS(1, 10, 9), keep = target.clone();
        f.resampledTo(target);
        f.times(f); f.plus(f); f.dividedBy(f); f.inverse(); f.negate(); f.restrictedToRadPerS(2, 8);
        f.times(TransferFunction.gain(3)); f.phaseRadUnwrapped(); f.magnitudeDb();
        assertArrayEquals(keep, target);
        assertEquals(copy, f);
    }

    @Test
    void singlePointFrfIsAllowedAndResamplesToItself() {
        Frf one = Frf.ofParts(new double[] {5}, new double[] {2}, new double[] {1});
        Frf back = one.resampledTo(new double[] {5});
        assertEquals(2.0, back.realAt(0), 1e-15);   // polar round trip: a few ulps
        assertEquals(1.0, back.imagAt(0), 1e-15);
        assertEquals(1, one.restrictedToRadPerS(5, 5).size());
    }
}
