package org.loopledger.ident.spectral;

/**
 * Data windows for spectral estimation, in their periodic ("DFT-even") form, the form
 * {@code scipy.signal.get_window(name, n)} returns by default (fftbins=True): the symmetric window
 * of n + 1 points with the last point dropped. Cosine-sum windows
 * w[k] = Σ<sub>j</sub> (-1)<sup>j</sup> a<sub>j</sub> cos(2πjk/n) with the coefficients of SciPy's
 * {@code scipy.signal.windows} (Hann: 0.5, 0.5; Hamming: 0.54, 0.46; Blackman: 0.42, 0.5, 0.08;
 * flat top: 0.21557895, 0.41663158, 0.277263158, 0.083578947, 0.006947368).
 */
public enum WindowType {
    RECTANGULAR(new double[] {1}),
    HANN(new double[] {0.5, 0.5}),
    HAMMING(new double[] {0.54, 0.46}),
    BLACKMAN(new double[] {0.42, 0.5, 0.08}),
    FLAT_TOP(new double[] {0.21557895, 0.41663158, 0.277263158, 0.083578947, 0.006947368});

    private final double[] a;

    WindowType(double[] a) { this.a = a; }

    /** The periodic window of length n (new array). */
    public double[] periodic(int n) {
        if (n < 1) throw new IllegalArgumentException("window length must be at least 1, got " + n);
        double[] w = new double[n];
        for (int k = 0; k < n; k++) {
            double s = 0;
            for (int j = 0; j < a.length; j++) {
                // exact argument reduction: (j*k mod n)/n
                double c = Math.cos(2 * Math.PI * (((long) j * k) % n) / n);
                s += ((j & 1) == 0 ? a[j] : -a[j]) * c;
            }
            w[k] = s;
        }
        return w;
    }

    /** SciPy's name for it, for messages and reference scripts. */
    public String scipyName() {
        return switch (this) {
            case RECTANGULAR -> "boxcar";
            case HANN -> "hann";
            case HAMMING -> "hamming";
            case BLACKMAN -> "blackman";
            case FLAT_TOP -> "flattop";
        };
    }
}
