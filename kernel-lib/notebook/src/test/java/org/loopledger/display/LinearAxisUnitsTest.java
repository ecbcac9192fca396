package org.loopledger.display;

import org.jsoup.Jsoup;
import org.jsoup.nodes.Document;
import org.junit.jupiter.api.Test;
import org.loopledger.control.DriveTiming;
import org.loopledger.control.FilterChain;
import org.loopledger.control.Piv;
import org.loopledger.frf.FrequencyGrid;
import org.loopledger.frf.Frf;
import org.loopledger.ident.fit.FitOptions;
import org.loopledger.ident.fit.ModelFit;
import org.loopledger.ident.fit.ParameterEstimate;
import org.loopledger.ident.fit.RigidBodyFit;
import org.loopledger.ident.fit.TwoMassFit;
import org.loopledger.ident.fit.TwoMassParameters;
import org.loopledger.lti.Motion;
import org.loopledger.lti.TransferFunction;
import org.loopledger.plot.BodePlot;
import org.loopledger.sim.ServoSimulation;
import org.loopledger.sim.TimeResponse;
import org.loopledger.tune.AutoTune;
import org.loopledger.tune.PlantCase;
import org.loopledger.tune.TuningResult;
import org.loopledger.tune.TuningSpec;

import java.util.ArrayList;
import java.util.List;

import static org.junit.jupiter.api.Assertions.*;

/**
 * A linear axis (linear motor carrying a compliantly coupled load; invented numbers, for the check only)
 * through fit → tune → display: the units are the SI units of translation (mass in kg, viscous friction
 * in N·s/m, force constant in N/A, velocity gain per m/s; common practice), the conventional forms are
 * K<sub>v</sub>/1000 per mm/s and K<sub>p</sub>·60/1000 in (m/min)/mm (common practice on machine tools),
 * and no rotary unit appears anywhere.
 */
class LinearAxisUnitsTest {
    // motor carriage 4 kg, load 8 kg, coupling 4e7 N/m, force constant 60 N/A, friction 30 N·s/m (invented)
    static final double MM = 4, ML = 8, K = 4e7, KF = 60, B = 30;
    // two-mass closed forms (common practice): ω_a = √(k/m_L), ω_r = √(k (m_M + m_L)/(m_M m_L))
    static final double FA = Math.sqrt(K / ML) / (2 * Math.PI), FR = Math.sqrt(K * (MM + ML) / (MM * ML)) / (2 * Math.PI);
    static final TwoMassParameters TRUTH = new TwoMassParameters(MM + ML, B, FR, 0.03, FA, 0.02, 0, Motion.LINEAR);

    static Frf measured() { return Frf.ofModel(TRUTH.model(KF, false), FrequencyGrid.logSpacedRadPerS(2, 3000, 600)); }

    static List<String> row(Document d, String first, int occurrence) {
        List<List<String>> rows = new ArrayList<>();
        for (var tr : d.select("tr")) {
            List<String> cells = tr.select("th, td").eachText();
            if (!cells.isEmpty() && cells.get(0).equals(first)) rows.add(cells);
        }
        assertTrue(rows.size() > occurrence, "row " + first + " #" + occurrence + " in " + d.select("tr").eachText());
        return rows.get(occurrence);
    }

    @Test
    void fitReportsMassInKgAndFrictionInNewtonSecondsPerMetre() {
        TwoMassFit fit = ModelFit.twoMass(measured(), FitOptions.velocity(Motion.LINEAR, KF));
        // noise-free model data: the fit returns the generator's numbers (1e-6 relative: the optimiser's tolerance)
        ParameterEstimate mass = fit.fit().parameter("mass");
        assertEquals("kg", mass.unit());
        assertEquals(MM + ML, mass.value(), 1e-6 * (MM + ML));
        assertEquals("N·s/m", fit.fit().parameter("viscous friction").unit());
        assertEquals(B, fit.fit().parameter("viscous friction").value(), 1e-5 * B);
        assertEquals(ML / MM, fit.fit().parameter("mass ratio").value(), 1e-5);
        assertEquals(Motion.LINEAR, fit.estimate().motion());
        assertEquals(K, fit.estimate().stiffnessNmPerRad(), 1e-5 * K, "k = m_L ω_a², N/m");
        String text = fit.toString();
        assertTrue(text.contains("m = 12.000 kg") && text.contains("N·s/m") && text.contains("mass ratio 2.000"), text);
        assertFalse(text.contains("kg·m²") || text.contains("rad") || text.contains("inertia"), text);
        Document d = Jsoup.parse(Bundles.of(fit.fit()).get(MimeBundle.TEXT_HTML).orElseThrow());
        assertEquals("kg", row(d, "mass", 0).get(2));
        assertEquals("N·s/m", row(d, "viscous friction", 0).get(2));
        assertTrue(FitOptions.velocity(Motion.LINEAR, KF).toString().contains("Kf = 60.00 N/A"));

        RigidBodyFit rigid = ModelFit.rigidBody(measured(), FitOptions.velocity(Motion.LINEAR, KF).bandHz(2, 60));
        assertTrue(rigid.toString().contains("m = ") && rigid.toString().contains(" kg, b = ") && !rigid.toString().contains("rad"), rigid.toString());
    }

    @Test
    void tuningOnTheFittedModelShowsGainsPerMetrePerSecondAndPerMillimetre() {
        TwoMassFit fit = ModelFit.twoMass(measured(), FitOptions.velocity(Motion.LINEAR, KF));
        TransferFunction model = fit.fit().model();
        double fc = 40, r = 5, wc = 2 * Math.PI * fc;
        TuningSpec spec = TuningSpec.builder().velocityCrossoverHz(fc).integralRatios(r).build();
        TuningResult t = AutoTune.onModel(model, Motion.LINEAR, DriveTiming.continuous(), FilterChain.none(), spec);
        assertEquals(Motion.LINEAR, t.motion());
        // rigid-body closed form (as AutoTuneTest, derivation by hand): Kv = m ω_c / (Kf √(1 + 1/r²)) in A per m/s.
        // Well below the antiresonance (40 Hz vs 356 Hz) the two-mass plant differs by (f/fa)² - (f/fr)² ≈ 0.8 % and the
        // friction by b/(m ω_c) ≈ 1 %: 3 % covers both and still catches a unit slip (a factor 1000 or 2π).
        double kvRigid = (MM + ML) * wc / (KF * Math.sqrt(1 + 1 / (r * r)));
        double kv = t.piv().velocity().velocityGain(), kp = t.piv().positionGainPerS();
        assertEquals(kvRigid, kv, 0.03 * kvRigid);

        String text = TuningReportText.of(t);
        assertTrue(text.contains("per m/s") && text.contains("per mm/s") && text.contains("(m/min)/mm"), text);
        assertFalse(text.contains("rad"), text);
        Document d = Jsoup.parse(Bundles.of(t).get(MimeBundle.TEXT_HTML).orElseThrow());
        List<String> kv1 = row(d, "velocity gain Kv", 0), kv2 = row(d, "velocity gain Kv", 1), kp2 = row(d, "position gain Kp", 1);
        assertEquals("A/(m/s)", kv1.get(2));
        assertEquals("A/(mm/s)", kv2.get(2));
        assertEquals("(m/min)/mm", kp2.get(2));
        // 6 significant digits in a drive-parameter cell
        assertEquals(kv / 1000, Double.parseDouble(kv2.get(1)), 5e-6 * kv / 1000);
        assertEquals(kp * 60 / 1000, Double.parseDouble(kp2.get(1)), 5e-6 * kp * 60 / 1000);
        assertFalse(d.text().contains("rad"), d.text());

        // simulated responses on the fitted model say m and m/s, and "force" for the disturbance
        ServoSimulation sim = ServoSimulation.of(model, t.piv(), t.filters(), DriveTiming.sampledAtHz(8000)).withMotion(Motion.LINEAR);
        TimeResponse step = sim.positionStep(10e-6, 0.2);
        assertEquals(Motion.LINEAR, step.metrics().motion());
        assertTrue(step.toString().contains("position step of 1e-05 m:") && !step.toString().contains("rad"), step.toString());
        Document sd = Jsoup.parse(Bundles.of(step.metrics()).get(MimeBundle.TEXT_HTML).orElseThrow());
        assertEquals("m", row(sd, "Peak following error", 0).get(2));
        TimeResponse dist = sim.torqueDisturbanceStep(1, 0.2);
        assertTrue(dist.toString().startsWith("force-disturbance step") && !dist.toString().contains("rad"), dist.toString());
        assertTrue(sim.velocityStep(0.01, 0.1).metrics().toString().contains(" m/s"));
    }

    @Test
    void rotaryStaysTheDefaultAndAxesDoNotMix() {
        Piv piv = Piv.of(150, 9696, 20);
        assertEquals(piv.toString(), piv.describe(Motion.ROTARY));
        assertTrue(piv.toString().contains("Kv = 9696 per rad/s"), piv.toString());
        assertTrue(piv.describe(Motion.LINEAR).contains("Kv = 9696 per m/s (9.696 per mm/s)"), piv.describe(Motion.LINEAR));
        assertTrue(piv.describe(Motion.LINEAR).contains("Kp = 150 1/s (9 (m/min)/mm)"), piv.describe(Motion.LINEAR));
        assertTrue(piv.toPid().describe(Motion.LINEAR).contains("per m,") && piv.toPid().describe(Motion.LINEAR).contains("per m/s"));
        assertEquals(Motion.ROTARY, FitOptions.velocity(0.5).motion());
        assertEquals(Motion.ROTARY, PlantCase.of("x", measured()).motion());
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> AutoTune.onMeasured(
                List.of(PlantCase.of("rotary", measured()), PlantCase.linear("linear", measured())), DriveTiming.continuous(), FilterChain.none(),
                TuningSpec.defaults()));
        assertTrue(e.getMessage().contains("'linear' is linear") && e.getMessage().contains("all rotary"), e.getMessage());
    }

    @Test
    void bodeMagnitudeAxisNamesThePlantUnit() {
        assertEquals("(m/s)/A", Motion.LINEAR.plantUnit(1, "A"));
        assertEquals("m/A", Motion.LINEAR.plantUnit(2, "A"));
        assertEquals("(rad/s²)/A", Motion.ROTARY.plantUnit(0, "A"));
        var fig = BodePlot.create().magnitudeUnit(Motion.LINEAR.plantUnit(1, "A")).add("carriage", measured()).figure();
        assertEquals("Magnitude (dB re 1 (m/s)/A)", fig.panels().get(0).getYAxisTitle());
        assertEquals("Magnitude (dB)", BodePlot.of("x", measured()).panels().get(0).getYAxisTitle(), "unchanged by default");
    }

    @Test
    void driveParameterListsCarryTheAxisUnitsAndTheCaution() {
        Piv piv = Piv.of(150, 9696, 20);
        // conversions by definition (common practice): (m/min)/mm = Kp·60/1000, per mm/s = Kv/1000, per rpm = Kv·2π/60, Ti = 1/(2π fi)
        List<DriveGains.Row> lin = DriveGains.of(piv, Motion.LINEAR).rows();
        assertEquals(List.of("1/s", "(m/min)/mm", "A/(m/s)", "A/(mm/s)", "Hz", "ms"), lin.stream().map(DriveGains.Row::unit).toList());
        assertEquals(9, lin.get(1).value(), 1e-12);
        assertEquals(9.696, lin.get(3).value(), 1e-12);
        assertEquals(1e3 / (2 * Math.PI * 20), lin.get(5).value(), 1e-9);
        List<DriveGains.Row> rot = DriveGains.of(piv, Motion.ROTARY).rows();
        assertEquals(List.of("1/s", "A/(rad/s)", "A/rpm", "Hz", "ms"), rot.stream().map(DriveGains.Row::unit).toList());
        assertEquals(9696 * 2 * Math.PI / 60, rot.get(2).value(), 1e-9);
        MimeBundle b = Bundles.of(DriveGains.of(piv, Motion.LINEAR));
        Document d = Jsoup.parse(b.get(MimeBundle.TEXT_HTML).orElseThrow());
        assertEquals(List.of("velocity gain Kv", "9.69600", "A/(mm/s)"), row(d, "velocity gain Kv", 1));
        assertTrue(d.text().contains("emergency stop") && b.plainText().contains("emergency stop"), "the caution travels with the numbers");
        assertFalse(d.text().contains("rad"), d.text());
    }
}
