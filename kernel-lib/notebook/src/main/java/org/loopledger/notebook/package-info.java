/**
 * Notebooks without Jupyter: the format-independent model ({@link org.loopledger.notebook.Notebook},
 * {@link org.loopledger.notebook.Cell}, {@link org.loopledger.notebook.Output}), its file forms
 * ({@link org.loopledger.notebook.NotebookJson} for nbformat 4 {@code .ipynb},
 * {@link org.loopledger.notebook.PlainTextNotebook} for the {@code .java} plain-text form, both read through
 * {@link org.loopledger.notebook.NotebookFile}), the headless {@link org.loopledger.notebook.NotebookRunner} on a
 * {@link org.loopledger.notebook.CellEngine}, {@code verify}'s comparisons ({@link org.loopledger.notebook.OutputComparison},
 * {@link org.loopledger.notebook.DatasetCheck}), and the self-contained HTML tuning record
 * ({@link org.loopledger.notebook.RecordRenderer}, {@link org.loopledger.notebook.RecordInfo},
 * {@link org.loopledger.notebook.SpecSummary}).
 *
 * <p>User files are written atomically ({@link org.loopledger.notebook.AtomicFiles}). From the command line these
 * are the {@code run}, {@code verify}, {@code render} and {@code convert} commands of {@link org.loopledger.cli}.
 */
package org.loopledger.notebook;
