package org.loopledger.kernel.session;

import java.util.ArrayList;
import java.util.List;

/**
 * The imports every session starts with: the library's packages that exist at run time (the
 * library grows package by package), Tablesaw's API, XChart, and the static display helpers.
 */
final class Preload {
    private static final List<String> LIBRARY_PACKAGES = List.of(
            "org.loopledger.lti", "org.loopledger.frf", "org.loopledger.ident.excitation", "org.loopledger.ident.log",
            "org.loopledger.ident.spectral", "org.loopledger.ident.estimate", "org.loopledger.ident.fit", "org.loopledger.ident.demo", "org.loopledger.control",
            "org.loopledger.analysis", "org.loopledger.tune", "org.loopledger.sim", "org.loopledger.plot",
            "org.loopledger.display");
    /** What the jshell tool imports by default, so cells read like ordinary Java. */
    private static final List<String> JDK_PACKAGES = List.of("java.util", "java.nio.file", "java.io", "java.util.stream");

    private Preload() {}

    static List<String> imports(ClassLoader loader) {
        List<String> result = new ArrayList<>();
        for (String p : LIBRARY_PACKAGES) {
            if (loader.getResource(p.replace('.', '/') + "/") != null) result.add("import " + p + ".*;");
        }
        for (String p : JDK_PACKAGES) result.add("import " + p + ".*;");
        result.add("import tech.tablesaw.api.*;");
        result.add("import org.knowm.xchart.*;");
        result.add("import static org.loopledger.display.Displays.*;");
        return result;
    }
}
