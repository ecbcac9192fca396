package org.loopledger.ident.spectral;

/**
 * What is removed from each segment before windowing: nothing, its mean ({@code detrend='constant'},
 * SciPy's default), or its least-squares straight line ({@code detrend='linear'}).
 */
public enum Detrend {
    NONE, CONSTANT, LINEAR;

    /** Applies the detrend to buf[0..n) in place (modified). */
    void apply(double[] buf, int n) {
        switch (this) {
            case NONE -> { }
            case CONSTANT -> {
                double s = 0;
                for (int i = 0; i < n; i++) s += buf[i];
                double m = s / n;
                for (int i = 0; i < n; i++) buf[i] -= m;
            }
            case LINEAR -> {
                // centred abscissa t_i = i - (n-1)/2: slope = Σ t·x / Σ t², intercept = mean
                double c = (n - 1) / 2.0, sx = 0, stx = 0, stt = 0;
                for (int i = 0; i < n; i++) {
                    double t = i - c;
                    sx += buf[i];
                    stx += t * buf[i];
                    stt += t * t;
                }
                double m = sx / n, slope = stt == 0 ? 0 : stx / stt;
                for (int i = 0; i < n; i++) buf[i] -= m + slope * (i - c);
            }
        }
    }

    public String scipyName() {
        return switch (this) {
            case NONE -> "False";
            case CONSTANT -> "'constant'";
            case LINEAR -> "'linear'";
        };
    }
}
