package org.loopledger.kernel.session;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;

/**
 * Everything one cell produced, stream pieces of the same stream merged when adjacent; {@link #error()}
 * is the failure that ended the cell, if any (it is also the last output).
 */
public record CellResult(List<CellOutput> outputs) {
    public CellResult {
        outputs = List.copyOf(outputs);
    }

    public Optional<CellOutput.Error> error() {
        return outputs.stream().filter(o -> o instanceof CellOutput.Error).map(o -> (CellOutput.Error) o).reduce((a, b) -> b);
    }

    public boolean ok() {
        return error().isEmpty();
    }

    /** Collects outputs, merging adjacent pieces of one stream. Thread-safe. */
    static final class Collector implements OutputListener {
        private final List<CellOutput> outputs = new ArrayList<>();
        private final OutputListener downstream;

        Collector(OutputListener downstream) {
            this.downstream = downstream;
        }

        @Override
        public synchronized void output(CellOutput o) {
            int last = outputs.size() - 1;
            if (o instanceof CellOutput.Stream s && last >= 0 && outputs.get(last) instanceof CellOutput.Stream p && p.name().equals(s.name())) {
                outputs.set(last, new CellOutput.Stream(s.name(), p.text() + s.text()));
            } else {
                outputs.add(o);
            }
            try {
                downstream.output(o);
            } catch (RuntimeException e) {
                System.err.println("loopledger: an output listener failed: " + e);
            }
        }

        synchronized CellResult result() {
            return new CellResult(outputs);
        }
    }
}
