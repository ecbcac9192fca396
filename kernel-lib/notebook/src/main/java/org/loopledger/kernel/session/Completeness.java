package org.loopledger.kernel.session;

/**
 * Whether a cell is ready to run, as in the {@code is_complete_reply} of the Jupyter messaging
 * specification 5.3: {@code status} is {@code complete}, {@code incomplete} or {@code invalid};
 * {@code indent} is what a console should put on the next line when incomplete.
 */
public record Completeness(String status, String indent) {
    public static final Completeness COMPLETE = new Completeness("complete", "");
    public static final Completeness INVALID = new Completeness("invalid", "");

    public static Completeness incomplete(String indent) {
        return new Completeness("incomplete", indent);
    }
}
