package org.loopledger.kernel.session.agent;

import jdk.jshell.execution.StreamingExecutionControl;

import java.io.IOException;
import java.io.ObjectInput;
import java.io.ObjectOutput;

/**
 * JShell's streaming control, with stop over the side channel, close that ends the agent JVM, and
 * extension commands written here.
 *
 * <p>Why {@link #extensionCommand} is ours: OpenJDK 17.0.21's {@code StreamingExecutionControl.extensionCommand}
 * throws {@code NotImplementedException} without sending anything (earlier 17 updates sent the command), while
 * the agent side ({@code ExecutionControlForwarder}) still dispatches unknown commands to
 * {@link AgentControl#extensionCommand}. So the command is written in the forwarder's wire format
 * (jdk.jshell.execution.RemoteCodes, read with {@code javap -constants}): the command prefix, the command name
 * (UTF), the argument (object); the reply is a status int, then the result object on success or a UTF message.
 * Only {@code NotImplementedException} is declared (17.0.21's signature, narrower than earlier updates', so this
 * compiles on both); a failing or unreachable agent is an {@code IllegalStateException}, which
 * {@code CellSession} treats as a dead agent.
 */
final class LauncherControl extends StreamingExecutionControl {
    private static final int COMMAND_PREFIX = 0xC03DC03D;
    static final int RESULT_SUCCESS = 100;
    private static final int RESULT_TERMINATED = 101;
    private static final int RESULT_NOT_IMPLEMENTED = 102;
    private static final int RESULT_INTERNAL_PROBLEM = 103;

    private final AgentConnection connection;
    private final ObjectOutput out;
    private final PipelinedInput in;

    LauncherControl(ObjectOutput out, ObjectInput in, AgentConnection connection) {
        this(out, PipelinedInput.over(in), connection);
    }

    private LauncherControl(ObjectOutput out, PipelinedInput in, AgentConnection connection) {
        super(out, in);
        this.out = out;
        this.in = in;
        this.connection = connection;
    }

    /**
     * Sends an extension command whose answer nobody needs, without waiting for it: the agent runs commands in
     * order, and the answer is dropped before the next read ({@link PipelinedInput}). Saves a round trip between
     * the two processes; a failure shows at the next command.
     */
    void sendWithoutWaiting(String command, Object arg) {
        try {
            synchronized (this) {
                writeCommand(command, arg);
                in.expectReply();
            }
        } catch (IOException e) {
            throw new IllegalStateException("agent JVM unreachable during " + command + ": " + e, e);
        }
    }

    /** Writes one extension command (prefix, name, argument) and flushes; the caller holds the lock. */
    private void writeCommand(String command, Object arg) throws IOException {
        out.writeInt(COMMAND_PREFIX);
        out.writeUTF(command);
        out.writeObject(arg);
        out.flush();
    }

    @Override
    public Object extensionCommand(String command, Object arg) throws NotImplementedException {
        try {
            synchronized (this) {
                writeCommand(command, arg);
                int status = in.readInt();
                switch (status) {
                    case RESULT_SUCCESS: return in.readObject();
                    case RESULT_NOT_IMPLEMENTED: throw new NotImplementedException(in.readUTF());
                    case RESULT_INTERNAL_PROBLEM: throw new IllegalStateException("the agent failed on " + command + ": " + in.readUTF());
                    case RESULT_TERMINATED: throw new IllegalStateException("the agent ended during " + command + ": " + in.readUTF());
                    default: throw new IllegalStateException("the agent answered extension command " + command + " with status " + status);
                }
            }
        } catch (IOException | ClassNotFoundException e) {
            throw new IllegalStateException("agent JVM unreachable during " + command + ": " + e, e);
        }
    }

    @Override
    public void stop() {
        connection.stopRunning();
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
