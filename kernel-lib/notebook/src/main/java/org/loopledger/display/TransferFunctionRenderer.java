package org.loopledger.display;

import org.loopledger.lti.TransferFunction;

/** A transfer function as typeset math ({@code text/latex}) and as its {@code toString()} for terminals. */
public final class TransferFunctionRenderer {
    private TransferFunctionRenderer() {}

    public static MimeBundle render(TransferFunction g) {
        return MimeBundle.builder(g.toString()).put(MimeBundle.TEXT_LATEX, Latex.of(g)).build();
    }
}
