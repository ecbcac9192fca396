package org.loopledger.cli;

import org.loopledger.kernel.session.CellOutput;
import org.loopledger.kernel.session.CellResult;
import org.loopledger.kernel.session.CellSession;
import org.loopledger.kernel.session.OutputListener;
import org.loopledger.kernel.session.SessionOptions;
import org.loopledger.notebook.CellEngine;
import org.loopledger.notebook.Output;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;

/** The kernel's JShell {@link CellSession} as the headless runner's {@link CellEngine}: same engine, same display. */
final class SessionEngine implements CellEngine {
    private final CellSession session;

    private SessionEngine(CellSession session) { this.session = session; }

    static SessionEngine start() { return new SessionEngine(CellSession.start(SessionOptions.defaults())); }

    @Override
    public List<Output> execute(String source, int executionCount) {
        CellResult r = session.execute(source, "cell [" + executionCount + "]", OutputListener.IGNORE);
        List<Output> out = new ArrayList<>();
        for (CellOutput o : r.outputs()) {
            if (o instanceof CellOutput.Stream s) out.add(new Output.Stream(s.name(), s.text()));
            else if (o instanceof CellOutput.Display d) out.add(new Output.DisplayData(d.bundle().data(), Map.of()));
            else if (o instanceof CellOutput.Result res) out.add(new Output.ExecuteResult(executionCount, res.bundle().data(), Map.of()));
            else if (o instanceof CellOutput.Error e) out.add(new Output.Error(e.name(), e.value(), e.traceback()));
        }
        return out;
    }

    @Override
    public String provenanceJson() { return session.provenanceJson(); }

    @Override
    public void interrupt() { session.interrupt(); }

    @Override
    public void forceStop() { session.killAgent(); }

    @Override
    public void close() { session.close(); }

}
