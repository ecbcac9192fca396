package org.loopledger.display;

/** A value that knows how to show itself in a notebook. Implement it in domain types that own their look. */
public interface Displayable {
    /** The representations of this value; must include text/plain (the builder enforces it). */
    MimeBundle toMimeBundle();
}
