package org.loopledger.ident.fit;

import org.loopledger.lti.TransferFunction;

import java.util.List;

/**
 * A fitted model with its parameters (physical units, 95 % intervals), the fit quality per band, the
 * overall reduced χ² of the weighted log residuals, how many FRF points and iterations it used, and the
 * warnings of the usability checks ({@link FitChecks}): a fit with any warning is not usable as it stands.
 */
public record FitResult(TransferFunction model, List<ParameterEstimate> parameters, List<BandQuality> quality, double reducedChiSquare,
                        int points, int iterations, List<FitWarning> warnings) {
    public FitResult {
        parameters = List.copyOf(parameters);
        quality = List.copyOf(quality);
        warnings = List.copyOf(warnings);
    }

    /** Whether the usability checks found nothing: every parameter inside the band and physical range, determined, not band-dependent. */
    public boolean isUsable() { return warnings.isEmpty(); }

    /** The same fit carrying {@code w}. */
    FitResult withWarnings(List<FitWarning> w) {
        return new FitResult(model, parameters, quality, reducedChiSquare, points, iterations, w);
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
        if (!warnings.isEmpty()) {
            sb.append(String.format(java.util.Locale.ROOT, "fit NOT usable: %d warning%s%n", warnings.size(), warnings.size() == 1 ? "" : "s"));
            for (FitWarning w : warnings) sb.append("  warning: ").append(w).append('\n');
        }
        return sb.toString();
    }
}
