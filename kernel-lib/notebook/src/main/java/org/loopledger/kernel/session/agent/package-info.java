/**
 * The JShell agent JVM: {@link org.loopledger.kernel.session.agent.AgentLauncher} starts it as a plain child
 * process and connects JShell to it ({@link org.loopledger.kernel.session.agent.AgentConnection});
 * {@link org.loopledger.kernel.session.agent.AgentMain} is its entry point. A cell that calls {@code System.exit}
 * or exhausts the heap ends only the agent; the session restarts it.
 */
package org.loopledger.kernel.session.agent;
