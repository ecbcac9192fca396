package org.loopledger.plot;

/** Phase branch for display: unwrapped, then shifted by whole turns so the first point lies in (-270°, 90°]. */
final class PlotPhase {
    private PlotPhase() {}

    static double[] forDisplayDeg(double[] unwrappedDeg) {
        double[] p = unwrappedDeg.clone();
        if (p.length == 0) return p;
        double shift = 0;
        while (p[0] + shift > 90) shift -= 360;
        while (p[0] + shift <= -270) shift += 360;
        for (int i = 0; i < p.length; i++) p[i] += shift;
        return p;
    }
}
