package org.loopledger.kernel.session.agent;

import jdk.jshell.execution.StreamingExecutionControl;

import java.io.IOException;
import java.io.ObjectInput;
import java.io.ObjectOutput;

/**
 * JShell's streaming control, with stop over the side channel, close that ends the agent JVM, and
 * extension commands written on the wire ourselves.
 *
 * <p>Why the last: JDK 17.0.21 hardened {@code StreamingExecutionControl}, whose
 * {@code extensionCommand} now throws "not implemented" instead of forwarding, while the agent side
 * ({@code ExecutionControlForwarder}) still dispatches unknown commands to
 * {@link AgentControl#extensionCommand}. The wire format is the forwarder's (JDK source
 * {@code jdk.jshell.execution.RemoteCodes}): the command prefix int, the command name (UTF), the
 * argument (object); the reply a status int and, on success, the result object. Only our own two
 * commands use it, and their results are Strings or null. Failures surface as the only checked
 * exception the overridden method may throw, {@code NotImplementedException}, with the reason.
 */
final class LauncherControl extends StreamingExecutionControl {
    /** {@code RemoteCodes.COMMAND_PREFIX}. */
    private static final int COMMAND_PREFIX = -1069694915;
    private static final int RESULT_SUCCESS = 100;
    private static final int RESULT_TERMINATED = 101;
    private static final int RESULT_NOT_IMPLEMENTED = 102;
    private static final int RESULT_INTERNAL_PROBLEM = 103;

    private final AgentConnection connection;
    private final ObjectOutput out;
    private final ObjectInput in;

    LauncherControl(ObjectOutput out, ObjectInput in, AgentConnection connection) {
        super(out, in);
        this.out = out;
        this.in = in;
        this.connection = connection;
    }

    @Override
    public void stop() {
        connection.stopRunning();
    }

    @Override
    public Object extensionCommand(String command, Object arg) throws NotImplementedException {
        synchronized (this) {
            try {
                out.writeInt(COMMAND_PREFIX);
                out.writeUTF(command);
                out.writeObject(arg);
                out.flush();
                int status = in.readInt();
                switch (status) {
                    case RESULT_SUCCESS:
                        return in.readObject();
                    case RESULT_TERMINATED:
                        throw new NotImplementedException(command + ": the agent ended: " + in.readUTF());
                    case RESULT_NOT_IMPLEMENTED:
                    case RESULT_INTERNAL_PROBLEM:
                        throw new NotImplementedException(command + ": " + in.readUTF());
                    default:
                        throw new NotImplementedException("unexpected reply " + status + " to extension command " + command);
                }
            } catch (IOException | ClassNotFoundException e) {
                throw new NotImplementedException("extension command " + command + " failed: " + e);
            }
        }
    }

    @Override
    public void close() {
        try {
            super.close();
        } finally {
            connection.close();
        }
    }
}
