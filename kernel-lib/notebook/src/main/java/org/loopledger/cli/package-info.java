/**
 * The {@code loopledger} command line ({@link org.loopledger.cli.Main}, picocli): {@code run} executes a notebook
 * headlessly, {@code verify} re-executes it and compares every output and dataset digest, {@code render} writes the
 * HTML tuning record, {@code convert} moves between {@code .ipynb} and the plain-text form, {@code kernel} serves
 * Jupyter, {@code install} writes the kernelspec and {@code datasets} writes the synthetic demo data. Commands that
 * live in other modules (the benchmarks) plug in as a {@link org.loopledger.cli.SubcommandProvider}.
 *
 * <p>Exit status: 0 success, 1 the work failed, 2 bad usage or input (nothing run or written), 3 a
 * {@code run --allow-errors} with failed cells.
 */
package org.loopledger.cli;
