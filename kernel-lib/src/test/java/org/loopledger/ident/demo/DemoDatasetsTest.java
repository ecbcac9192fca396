package org.loopledger.ident.demo;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.HexFormat;

import static org.junit.jupiter.api.Assertions.*;

/**
 * The committed datasets are exactly what the generator produces (SHA-256 of a fresh in-memory run
 * against the files), so they cannot drift from the documented parameters; and they are marked synthetic.
 */
class DemoDatasetsTest {
    static String sha256(byte[] b) throws NoSuchAlgorithmException {
        return HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(b));
    }

    @ParameterizedTest
    @EnumSource(GantryLoadCase.class)
    void committedCsvMatchesTheGenerator(GantryLoadCase c) throws Exception {
        Path file = DatasetsFolder.find().resolve(c.fileName());
        byte[] committed = Files.readAllBytes(file);
        byte[] fresh = DemoDatasets.csv(c).getBytes(StandardCharsets.UTF_8);
        assertEquals(sha256(fresh), sha256(committed), file + " differs from the generator; rerun DemoDatasets (and say why in the commit)");
        assertTrue(committed.length < 4_000_000, "keep each dataset below 4 MB, got " + committed.length);
    }

    @Test
    void readmeMatchesTheGeneratorAndSaysSynthetic() throws IOException, NoSuchAlgorithmException {
        String readme = Files.readString(DatasetsFolder.find().resolve("README.md"), StandardCharsets.UTF_8);
        assertEquals(sha256(DemoDatasets.readme().getBytes(StandardCharsets.UTF_8)), sha256(readme.getBytes(StandardCharsets.UTF_8)));
        assertTrue(readme.contains("**These data are synthetic.**"));
    }

    @Test
    void simulationIsDeterministicAndTheResonanceSitsAFewHundredHertzUp() {
        var a = DemoDatasets.simulate(GantryLoadCase.EMPTY_CARRIAGE);
        var b = DemoDatasets.simulate(GantryLoadCase.EMPTY_CARRIAGE);
        assertArrayEquals(a.velocityRadPerS(), b.velocityRadPerS(), 0.0);
        for (GantryLoadCase c : GantryLoadCase.values()) {
            double fr = DemoDatasets.truth(c).resonanceHz();
            assertTrue(fr > 200 && fr < 600, c + " resonance " + fr + " Hz");
        }
        // heavier load → lower resonance and antiresonance, higher inertia ratio (physics of the two-mass model)
        assertTrue(DemoDatasets.truth(GantryLoadCase.HEAVY_HEAD).resonanceHz() < DemoDatasets.truth(GantryLoadCase.EMPTY_CARRIAGE).resonanceHz());
        assertTrue(DemoDatasets.truth(GantryLoadCase.HEAVY_HEAD).inertiaRatio() > DemoDatasets.truth(GantryLoadCase.LIGHT_HEAD).inertiaRatio());
    }

    @Test
    void expmMatchesTheClosedFormOfARotation() {
        // Derivation by hand: exp([[0, w], [-w, 0]]) = [[cos w, sin w], [-sin w, cos w]]
        double w = 0.7;
        double[][] e = GantrySimulator.expm(new double[][] {{0, w}, {-w, 0}});
        assertEquals(Math.cos(w), e[0][0], 1e-15);
        assertEquals(Math.sin(w), e[0][1], 1e-15);
        assertEquals(-Math.sin(w), e[1][0], 1e-15);
    }
}
