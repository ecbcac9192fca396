package org.loopledger.display;

import org.jsoup.Jsoup;
import org.jsoup.nodes.Document;
import org.junit.jupiter.api.Test;
import org.loopledger.control.Pid;
import org.loopledger.control.Piv;
import org.loopledger.control.VelocityPi;
import org.loopledger.lti.Motion;

import java.util.List;

import static org.junit.jupiter.api.Assertions.*;

/** Gains in the drive's units; conversions checked against their definitions, worked out here. */
class DriveGainsTest {
    static double value(Document d, String parameter, String unit) {
        for (var tr : d.select("tr")) {
            List<String> c = tr.select("td").eachText();
            if (c.size() == 3 && c.get(0).equals(parameter) && c.get(2).equals(unit)) return Double.parseDouble(c.get(1));
        }
        throw new AssertionError("no row " + parameter + " [" + unit + "] in " + d.select("tr").eachText());
    }

    static Document html(Object v) {
        String h = Bundles.of(v).get(MimeBundle.TEXT_HTML).orElseThrow();
        MarginsTableTest.wellFormed(h);
        return Jsoup.parse(h);
    }

    @Test
    void pivOnARotaryAxisShowsPerRadPerSAndPerRpm() {
        Document d = html(Piv.of(50, 0.3, 20));
        assertEquals(50, value(d, "position gain Kp", "1/s"), 0);
        assertEquals(0.3, value(d, "velocity gain Kv", "A/(rad/s)"), 0);
        // 1 rpm = 2π/60 rad/s, so A per rpm = 0.3·2π/60 (definition of the rpm).
        assertEquals(0.3 * 2 * Math.PI / 60, value(d, "velocity gain Kv", "A/rpm"), 1e-6 * 0.0314);
        // Ti = 1/ωi = 1/(2π·20 Hz) = 7.958 ms.
        assertEquals(1e3 / (2 * Math.PI * 20), value(d, "velocity-integral time Ti", "ms"), 1e-5);
        assertTrue(d.text().contains(DriveCaution.TEXT), "caution beside numbers typed into a drive");
    }

    @Test
    void linearAxisAndScrewAxisShowTheCarriageUnits() {
        Document lin = html(DriveGains.of(Piv.of(50, 300, 20)).linear());
        // (m/min)/mm: 1/s·60 s/min / 1000 mm/m (common practice on machine tools) = 3.
        assertEquals(3, value(lin, "position gain Kp", "(m/min)/mm"), 1e-9);
        assertEquals(0.3, value(lin, "velocity gain Kv", "A/(mm/s)"), 1e-9);
        // A 10 mm lead: 1 mm/s of carriage is 0.1 rev/s = 0.2π rad/s of motor, so Kv = 0.3·0.2π A per mm/s.
        Document screw = html(DriveGains.of(Piv.of(50, 0.3, 20)).withScrewLeadM(0.010));
        assertEquals(0.3 * 0.2 * Math.PI, value(screw, "velocity gain Kv at the carriage", "A/(mm/s)"), 1e-6);
        assertEquals(3, value(screw, "position gain Kp", "(m/min)/mm"), 1e-9);
        assertTrue(screw.select("caption").text().contains("lead 10 mm"));
    }

    @Test
    void velocityPiAndPidHaveTheirOwnRows() {
        Document v = html(VelocityPi.of(0.5, 0));
        assertEquals(0.5, value(v, "velocity gain Kv", "A/(rad/s)"), 0);
        assertEquals(0, value(v, "velocity-integral corner", "Hz (no integral action)"), 0);
        Document p = html(Pid.of(20, 100, 0.5, 500));
        assertEquals(20, value(p, "proportional gain KP", "A/rad"), 0);
        assertEquals(100, value(p, "integral gain KI", "A/(rad·s)"), 0);
        assertEquals(500, value(p, "derivative filter corner", "Hz"), 1e-3);
        // τ = 1/(2π·500 Hz) = 0.3183 ms.
        assertEquals(1e3 / (2 * Math.PI * 500), value(p, "derivative filter time constant", "ms"), 1e-6);
        assertTrue(p.text().contains(DriveCaution.TEXT));
    }

    @Test
    void badInputNamesTheFix() {
        var e = assertThrows(IllegalArgumentException.class, () -> DriveGains.of(Piv.of(50, 0.3, 20)).withScrewLeadM(-1));
        assertTrue(e.getMessage().contains("metres per turn"), e.getMessage());
        assertThrows(IllegalArgumentException.class, () -> DriveGains.of(Piv.of(50, 0.3, 20), Motion.LINEAR).withScrewLeadM(0.01));
    }

    @Test
    void textIsDeterministicAndEndsWithTheCaution() {
        String a = Bundles.of(Piv.of(50, 0.3, 20)).plainText(), b = Bundles.of(Piv.of(50, 0.3, 20)).plainText();
        assertEquals(a, b);
        assertTrue(a.endsWith("Caution: " + DriveCaution.TEXT), a);
        assertFalse(a.contains("@"));
    }
}
