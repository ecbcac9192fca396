package org.loopledger.kernel.session.agent;

import jdk.jshell.execution.StreamingExecutionControl;

import java.io.ObjectInput;
import java.io.ObjectOutput;

/** JShell's streaming control, with stop over the side channel and close that ends the agent JVM. */
final class LauncherControl extends StreamingExecutionControl {
    private final AgentConnection connection;

    LauncherControl(ObjectOutput out, ObjectInput in, AgentConnection connection) {
        super(out, in);
        this.connection = connection;
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
