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

    /**
     * Collects outputs, merging adjacent pieces of one stream. Thread-safe. Linear in the size of the
     * output: the stream being written grows in one builder (doubling) and becomes a string only when
     * another output follows or the result is taken (stream text arrives in pieces of about 127 bytes).
     */
    static final class Collector implements OutputListener {
        private final List<CellOutput> outputs = new ArrayList<>();
        private final OutputListener downstream;
        private String openName;
        private final StringBuilder openText = new StringBuilder();

        Collector(OutputListener downstream) {
            this.downstream = downstream;
        }

        @Override
        public synchronized void output(CellOutput o) {
            if (o instanceof CellOutput.Stream s) {
                if (!s.name().equals(openName)) {
                    closeStream();
                    openName = s.name();
                }
                openText.append(s.text());
            } else {
                closeStream();
                outputs.add(o);
            }
            try {
                downstream.output(o);
            } catch (RuntimeException e) {
                System.err.println("loopledger: an output listener failed: " + e);
            }
        }

        private void closeStream() {
            if (openName == null) return;
            outputs.add(new CellOutput.Stream(openName, openText.toString()));
            openName = null;
            openText.setLength(0);
        }

        synchronized CellResult result() {
            closeStream();
            return new CellResult(outputs);
        }
    }
}
