/**
 * The Jupyter kernel: {@link org.loopledger.kernel.KernelServer} speaks the messaging protocol 5.3 over JeroMQ
 * (shell, control, iopub, stdin, heartbeat; signed messages; interrupts, restart, completion, inspection) and runs
 * cells in a {@link org.loopledger.kernel.session.CellSession}; {@link org.loopledger.kernel.Kernelspec} writes the
 * kernelspec Jupyter uses to start it. The wire format is in {@link org.loopledger.kernel.protocol}.
 */
package org.loopledger.kernel;
