package org.loopledger.kernel;

import com.google.gson.JsonArray;
import com.google.gson.JsonObject;
import org.loopledger.kernel.protocol.Headers;
import org.loopledger.notebook.KernelIdentity;

/** The {@code kernel_info_reply} content (Jupyter messaging specification 5.3). */
final class KernelInfo {
    static final String IMPLEMENTATION = "loopledger";

    private KernelInfo() {}

    static String version() {
        String v = KernelInfo.class.getPackage().getImplementationVersion();
        return v == null ? "0.1.0-SNAPSHOT" : v;
    }

    static JsonObject content() {
        JsonObject c = new JsonObject();
        c.addProperty("status", "ok");
        c.addProperty("protocol_version", Headers.PROTOCOL_VERSION);
        c.addProperty("implementation", IMPLEMENTATION);
        c.addProperty("implementation_version", version());
        c.add("language_info", KernelIdentity.languageInfo());
        c.addProperty("banner", "Loopledger " + version() + " on Java " + Runtime.version() + " (JShell). display(...), markdown(...) and the library's packages are imported.");
        c.add("help_links", new JsonArray());
        c.addProperty("debugger", false);
        return c;
    }
}
