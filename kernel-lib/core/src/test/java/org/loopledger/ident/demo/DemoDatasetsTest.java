package org.loopledger.ident.demo;

import org.junit.jupiter.api.Test;
import org.loopledger.ident.log.ColumnMap;
import org.loopledger.ident.log.DriveLog;
import org.loopledger.ident.log.DriveLogReader;
import org.loopledger.ident.log.LogCheckOptions;
import org.loopledger.ident.log.LogUnit;
import org.loopledger.ident.log.Quantity;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;

import java.io.IOException;
import java.util.List;
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
    void committedLinearAxisScopeExportMatchesTheGenerator() throws Exception {
        Path file = DatasetsFolder.find().resolve(LinearAxisScope.FILE);
        byte[] committed = Files.readAllBytes(file);
        byte[] fresh = LinearAxisScope.csv().getBytes(StandardCharsets.UTF_8);
        assertEquals(sha256(fresh), sha256(committed), file + " differs from the generator; rerun DemoDatasets (and say why in the commit)");
        assertTrue(committed.length < 1_000_000, "keep the scope export below 1 MB, got " + committed.length);
        assertTrue(new String(committed, 0, 200, StandardCharsets.UTF_8).startsWith("# SYNTHETIC demo data"));
    }

    @Test
    void linearAxisScopeExportReadsBackToTheSimulationThroughAColumnMap() throws IOException {
        ColumnMap map = ColumnMap.of()
                .column("Pos act [inc]", Quantity.POSITION, LogUnit.countsPerMetre(LinearAxisScope.COUNTS_PER_METRE))
                .column("Vel act [mm/s]", Quantity.VELOCITY, LogUnit.millimetresPerSecond())
                .column("Iq act [mA]", Quantity.CURRENT_MEASURED, LogUnit.milliamperes())
                .column("Iq inj [mA]", Quantity.CURRENT_INJECTED, LogUnit.milliamperes());
        DriveLog log = DriveLogReader.read(DatasetsFolder.find().resolve(LinearAxisScope.FILE), map, LogCheckOptions.defaults());
        assertEquals(8000, log.sampleRateHz(), 0.0);
        assertEquals(LinearAxisScope.PERIOD_SAMPLES * LinearAxisScope.PERIODS, log.rows());
        assertTrue(log.warnings().isEmpty(), log.warnings().toString());
        var r = LinearAxisScope.simulate();
        // printed to 0.001 mm/s and 0.1 mA: half a unit of the last digit, plus the decimal-to-binary rounding
        assertArrayEquals(r.velocityMPerS(), log.velocityMPerS(), 0.5e-6 * (1 + 1e-9));
        assertArrayEquals(r.measuredA(), log.measuredCurrentA(), 0.5e-4 * (1 + 1e-9));
        assertArrayEquals(r.injectedA(), log.injectedCurrentA(), 1e-12);
        assertArrayEquals(r.positionM(), log.positionM(), 1e-15);
        // the structural resonance of the invented axis sits where the scenario says (two-mass physics:
        // resonance above antiresonance, ωr²/ωa² = 1 + m2/m1 for light damping; hand derivation)
        var t = LinearAxisScope.truth();
        assertTrue(t.resonanceHz() > 150 && t.resonanceHz() < 250, "resonance " + t.resonanceHz());
        assertEquals(1 + 1.3 / 4.2, Math.pow(t.resonanceHz() / t.antiresonanceHz(), 2), 1e-3);
        assertEquals(5.5, t.massKg(), 1e-3);
        // as the fit's parameters: the same numbers on a linear axis, and the mass ratio of the two-mass model's
        // undamped formula (ωr/ωa)² - 1 lands within 1e-3 of the invented head/carriage ratio 1.3/4.2 (hand derivation above)
        var p = t.twoMass();
        assertEquals(org.loopledger.lti.Motion.LINEAR, p.motion());
        assertEquals(List.of(t.massKg(), t.viscousNsPerM(), t.resonanceHz(), t.resonanceDamping(), t.antiresonanceHz(), t.antiresonanceDamping(), t.delayS()),
                List.of(p.inertiaKgM2(), p.viscousNmsPerRad(), p.resonanceHz(), p.resonanceDamping(), p.antiresonanceHz(), p.antiresonanceDamping(), p.delayS()));
        assertEquals(1.3 / 4.2, p.inertiaRatio(), 1e-3);
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
