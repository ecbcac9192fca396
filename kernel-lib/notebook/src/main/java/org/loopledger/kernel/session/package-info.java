/**
 * The cell evaluation engine shared by the Jupyter kernel and the headless runner:
 * {@link org.loopledger.kernel.session.CellSession} runs cells in JShell (in a separate agent JVM, started from
 * {@link org.loopledger.kernel.session.SessionOptions}) with the library and its common imports preloaded, and
 * returns a {@link org.loopledger.kernel.session.CellResult} of {@link org.loopledger.kernel.session.CellOutput}s
 * (streams, rich displays, the result, an error); it also answers completion
 * ({@link org.loopledger.kernel.session.Completions}) and is-complete
 * ({@link org.loopledger.kernel.session.Completeness}) requests.
 */
package org.loopledger.kernel.session;
