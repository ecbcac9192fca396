package org.loopledger.notebook;

import com.google.gson.JsonObject;

/**
 * The one source of the kernel's identity in notebook metadata: the kernelspec name and display name,
 * and the {@code language_info} the kernel reports in {@code kernel_info_reply} (Jupyter messaging
 * specification 5.3). The kernelspec ({@code kernel.Kernelspec}), {@code kernel_info_reply}
 * ({@code kernel.KernelInfo}), the runner ({@link NotebookRunner}) and new notebooks
 * ({@link PlainTextNotebook}) all read it here, so saving a notebook from Jupyter changes none of
 * its metadata. It lives in {@code notebook} because {@code kernel} may import {@code notebook}, never
 * the reverse.
 */
public final class KernelIdentity {
    /** The kernelspec directory name and {@code metadata.kernelspec.name}. */
    public static final String NAME = "loopledger";
    /** What Jupyter shows in its kernel list and writes as {@code metadata.kernelspec.display_name}. */
    public static final String DISPLAY_NAME = "Loopledger (Java)";
    public static final String LANGUAGE = "java";

    private KernelIdentity() {}

    /** {@code metadata.kernelspec}, as Jupyter writes it when saving a notebook on this kernel. */
    public static JsonObject kernelspec() {
        JsonObject ks = new JsonObject();
        ks.addProperty("display_name", DISPLAY_NAME);
        ks.addProperty("language", LANGUAGE);
        ks.addProperty("name", NAME);
        return ks;
    }

    /**
     * {@code language_info} of {@code kernel_info_reply}, which Jupyter front-ends and nbclient copy into
     * {@code metadata.language_info}: the version is this JVM's {@code feature.interim.update}.
     */
    public static JsonObject languageInfo() {
        JsonObject lang = new JsonObject();
        lang.addProperty("codemirror_mode", "text/x-java");
        lang.addProperty("file_extension", ".java");
        lang.addProperty("mimetype", "text/x-java-source");
        lang.addProperty("name", LANGUAGE);
        lang.addProperty("pygments_lexer", "java");
        Runtime.Version v = Runtime.version();
        lang.addProperty("version", v.feature() + "." + v.interim() + "." + v.update());
        return lang;
    }

    /** Notebook metadata naming this kernel: {@code kernelspec} and {@code language_info}. */
    public static JsonObject notebookMetadata() {
        JsonObject meta = new JsonObject();
        meta.add("kernelspec", kernelspec());
        meta.add("language_info", languageInfo());
        return meta;
    }
}
