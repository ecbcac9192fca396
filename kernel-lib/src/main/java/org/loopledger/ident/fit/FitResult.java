package org.loopledger.ident.fit;

import org.loopledger.lti.TransferFunction;

import java.util.List;

/**
 * A fitted model with its parameters (physical units, 95 % intervals), the fit quality per band, the
 * overall reduced χ² of the weighted log residuals, and how many FRF points and iterations it used.
 */
public record FitResult(TransferFunction model, List<ParameterEstimate> parameters, List<BandQuality> quality, double reducedChiSquare,
                        int points, int iterations) {
    public FitResult {
        parameters = List.copyOf(parameters);
        quality = List.copyOf(quality);
    }

    /** The estimate named {@code name}; throws listing the names when absent. */
    public ParameterEstimate parameter(String name) {
        for (ParameterEstimate p : parameters) if (p.name().equals(name)) return p;
        throw new IllegalArgumentException("no fitted parameter '" + name + "'; the fit has " + parameters.stream().map(ParameterEstimate::name).toList());
    }

    @Override public String toString() {
        StringBuilder sb = new StringBuilder();
        sb.append(String.format(java.util.Locale.ROOT, "fit on %d points, %d iterations, reduced chi² %.3g%n", points, iterations, reducedChiSquare));
        for (ParameterEstimate p : parameters) sb.append("  ").append(p).append('\n');
        for (BandQuality q : quality) sb.append("  ").append(q).append('\n');
        return sb.toString();
    }
}
