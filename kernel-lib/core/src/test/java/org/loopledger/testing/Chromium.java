package org.loopledger.testing;

import com.google.gson.JsonObject;
import com.google.gson.JsonParser;
import org.junit.jupiter.api.Assumptions;

import javax.imageio.ImageIO;
import java.awt.image.BufferedImage;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.concurrent.TimeUnit;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Stream;

/**
 * Debian's headless Chromium ({@code /usr/bin/chromium}, package {@code chromium}) as the outside
 * reference for how a tuning record really renders: a screenshot, the console log, and the layout
 * of every image measured after the page has loaded.
 *
 * <p>Every run uses a fresh profile and the flags for a closed network (no background networking,
 * component updates, sync or QUIC). Where Chromium is missing the test is skipped on a developer
 * machine and fails under {@code CI=true}, like {@link PythonOracle}.
 *
 * <p>Layout is measured by a test-only harness page that loads the record in an iframe (file URLs
 * made same-origin with {@code --allow-file-access-from-files}) and, on its load event, writes what
 * it finds into the DOM, which {@code --dump-dom} prints. The record itself stays script-free.
 */
public final class Chromium {
    private static final List<String> CLOSED_NETWORK = List.of("--headless", "--no-sandbox", "--disable-gpu", "--disable-quic", "--no-first-run",
            "--disable-background-networking", "--disable-component-update", "--disable-sync", "--disable-extensions",
            "--disable-default-apps", "--mute-audio", "--hide-scrollbars");

    private Chromium() {}

    /** The browser: {@code LOOPLEDGER_CHROMIUM} if set, else {@code /usr/bin/chromium}. */
    public static Path executable() {
        String p = System.getenv("LOOPLEDGER_CHROMIUM");
        return Path.of(p == null || p.isBlank() ? "/usr/bin/chromium" : p);
    }

    /** Skips (or fails under CI=true) unless Chromium is installed. */
    public static void require() {
        if (Files.isExecutable(executable())) return;
        String why = executable() + " not found; install Debian's chromium package";
        if ("true".equals(System.getenv("CI"))) throw new AssertionError("reference tool missing under CI: " + why);
        Assumptions.assumeTrue(false, why);
    }

    /** What one browser run printed. */
    public record Run(int exitCode, String stdout, String stderr) {
        /** Messages the page wrote to its console (Chromium logs them as {@code INFO:CONSOLE}). */
        public List<String> consoleMessages() {
            List<String> r = new ArrayList<>();
            for (String line : stderr.split("\n")) if (line.contains(":CONSOLE")) r.add(line.strip());
            return r;
        }
    }

    /** A screenshot of {@code page} in a window of the given size, plus the console log of that load. */
    public record Shot(BufferedImage image, List<String> consoleMessages) {}

    /** Runs the browser once on {@code url} with extra flags, in a fresh profile under {@code work}. */
    public static Run run(Path work, List<String> flags, String url) {
        Path profile = null;
        try {
            profile = Files.createTempDirectory(work, "chromium-profile-");
            List<String> cmd = new ArrayList<>();
            cmd.add(executable().toString());
            cmd.addAll(CLOSED_NETWORK);
            cmd.add("--user-data-dir=" + profile);
            cmd.addAll(flags);
            cmd.add(url);
            Path out = profile.resolve("stdout.txt"), err = profile.resolve("stderr.txt");
            Process p = new ProcessBuilder(cmd).redirectOutput(out.toFile()).redirectError(err.toFile()).start();
            // Generous: a cold Chromium on a loaded two-core machine takes a few seconds; a hang must not block the build.
            if (!p.waitFor(180, TimeUnit.SECONDS)) {
                p.descendants().forEach(ProcessHandle::destroyForcibly);
                p.destroyForcibly();
                throw new AssertionError("Chromium did not finish within 180 s on " + url);
            }
            return new Run(p.exitValue(), Files.readString(out, StandardCharsets.UTF_8), Files.readString(err, StandardCharsets.UTF_8));
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new AssertionError("interrupted", e);
        } finally {
            if (profile != null) deleteTree(profile);
        }
    }

    /** Screenshot of a local HTML file, with console logging on. */
    public static Shot screenshot(Path work, Path page, int widthPx, int heightPx) {
        Path png = work.resolve("shot-" + System.nanoTime() + ".png");
        Run r = run(work, List.of("--enable-logging=stderr", "--v=0", "--screenshot=" + png, "--window-size=" + widthPx + "," + heightPx,
                "--virtual-time-budget=5000"), page.toUri().toString());
        try {
            if (!Files.exists(png)) throw new AssertionError("Chromium wrote no screenshot (exit " + r.exitCode() + "): " + tail(r.stderr()));
            BufferedImage img = ImageIO.read(png.toFile());
            Files.delete(png);
            return new Shot(img, r.consoleMessages());
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    private static final String HARNESS = """
            <!DOCTYPE html><html><head><meta charset="utf-8"><title>harness</title></head><body>
            <iframe id="f" src="%s" style="width:%dpx;height:%dpx;border:0"></iframe>
            <pre id="layout-result"></pre>
            <script>
            window.addEventListener('load', function () {
              var d = document.getElementById('f').contentDocument;
              var out = {images: [], resources: [], scripts: 0, handlers: [], title: '', text: ''};
              if (!d) { document.getElementById('layout-result').textContent = JSON.stringify({error: 'record not accessible'}); return; }
              d.querySelectorAll('img, svg, object, embed, iframe, video, canvas').forEach(function (e) {
                var r = e.getBoundingClientRect();
                out.images.push({tag: e.tagName.toLowerCase(), src: (e.getAttribute('src') || '').slice(0, 48), complete: e.tagName !== 'IMG' || e.complete,
                  naturalWidth: e.naturalWidth || 0, naturalHeight: e.naturalHeight || 0, width: r.width, height: r.height});
              });
              d.defaultView.performance.getEntriesByType('resource').forEach(function (e) { out.resources.push(e.name); });
              out.scripts = d.querySelectorAll('script').length;
              d.querySelectorAll('*').forEach(function (e) {
                for (var i = 0; i < e.attributes.length; i++) {
                  var n = e.attributes[i].name.toLowerCase();
                  if (n.indexOf('on') === 0) out.handlers.push(e.tagName.toLowerCase() + '[' + n + ']');
                }
              });
              out.title = d.title;
              out.text = d.body ? d.body.innerText : '';
              try { out.probe = (%s)(d); } catch (err) { out.probe = {error: String(err)}; }
              document.getElementById('layout-result').textContent = JSON.stringify(out);
            });
            </script></body></html>
            """;
    private static final Pattern RESULT = Pattern.compile("<pre id=\"layout-result\">(.*?)</pre>", Pattern.DOTALL);

    /**
     * Loads {@code page} in the harness after layout and returns, as JSON: {@code images} (tag, src
     * prefix, complete, naturalWidth/Height, laid-out width/height of every img, svg, object, embed,
     * iframe, video, canvas), {@code resources} (every URL the page fetched), {@code scripts} (count
     * of script elements), {@code handlers} (every on* attribute), {@code title}, {@code text}
     * (the page's visible text), {@code probe} (null).
     */
    public static JsonObject layout(Path work, Path page, int widthPx) {
        return layout(work, page, widthPx, "function (d) { return null; }");
    }

    /**
     * As {@link #layout(Path, Path, int)}, plus {@code probe}: what the JavaScript function {@code probeJs}
     * returns when called with the record's document after load (JSON-serialisable; an exception it throws
     * is reported as {@code {"error": ...}}). The function runs in the harness, never in the record.
     */
    public static JsonObject layout(Path work, Path page, int widthPx, String probeJs) {
        Path harness = page.toAbsolutePath().resolveSibling("harness-" + System.nanoTime() + ".html");
        try {
            Files.writeString(harness, String.format(java.util.Locale.ROOT, HARNESS, page.getFileName().toString(), widthPx, 20000, probeJs));
            Run r = run(work, List.of("--allow-file-access-from-files", "--virtual-time-budget=10000", "--dump-dom",
                    "--window-size=" + (widthPx + 40) + ",1000"), harness.toUri().toString());
            Matcher m = RESULT.matcher(r.stdout());
            if (!m.find() || m.group(1).isBlank()) throw new AssertionError("the layout harness reported nothing (exit " + r.exitCode() + "): " + tail(r.stderr()));
            String json = m.group(1).replace("&lt;", "<").replace("&gt;", ">").replace("&quot;", "\"").replace("&#39;", "'").replace("&nbsp;", "\u00a0").replace("&amp;", "&");
            JsonObject o = JsonParser.parseString(json).getAsJsonObject();
            if (o.has("error")) throw new AssertionError("layout harness: " + o.get("error").getAsString());
            return o;
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        } finally {
            try { Files.deleteIfExists(harness); } catch (IOException ignored) { /* temp dir is cleaned by JUnit */ }
        }
    }

    /** Number of distinct RGB colours in an image. */
    public static int distinctColours(BufferedImage img) {
        java.util.BitSet seen = new java.util.BitSet(1 << 24);
        for (int y = 0; y < img.getHeight(); y++) for (int x = 0; x < img.getWidth(); x++) seen.set(img.getRGB(x, y) & 0xFFFFFF);
        return seen.cardinality();
    }

    /** Pixels within {@code tolerance} (per channel) of the colour {@code rgb}. */
    public static int pixelsNear(BufferedImage img, int rgb, int tolerance) {
        int r0 = (rgb >> 16) & 0xFF, g0 = (rgb >> 8) & 0xFF, b0 = rgb & 0xFF, n = 0;
        for (int y = 0; y < img.getHeight(); y++) {
            for (int x = 0; x < img.getWidth(); x++) {
                int c = img.getRGB(x, y);
                if (Math.abs(((c >> 16) & 0xFF) - r0) <= tolerance && Math.abs(((c >> 8) & 0xFF) - g0) <= tolerance && Math.abs((c & 0xFF) - b0) <= tolerance) n++;
            }
        }
        return n;
    }

    private static String tail(String s) { return s.length() > 2000 ? s.substring(s.length() - 2000) : s; }

    private static void deleteTree(Path dir) {
        try (Stream<Path> s = Files.walk(dir)) {
            s.sorted(Comparator.reverseOrder()).forEach(p -> { try { Files.deleteIfExists(p); } catch (IOException ignored) { /* best effort */ } });
        } catch (IOException ignored) {
            // best effort: the profile lives under a JUnit temp dir that is removed anyway
        }
    }
}
