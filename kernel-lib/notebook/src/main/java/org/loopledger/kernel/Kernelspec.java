package org.loopledger.kernel;

import com.google.gson.GsonBuilder;
import com.google.gson.JsonArray;
import com.google.gson.JsonObject;
import org.loopledger.notebook.KernelIdentity;

import javax.imageio.ImageIO;
import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Graphics2D;
import java.awt.RenderingHints;
import java.awt.geom.Path2D;
import java.awt.geom.RoundRectangle2D;
import java.awt.image.BufferedImage;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;

/**
 * Writes the kernelspec directory {@value #NAME} (Jupyter client documentation, "Kernel specs"):
 * {@code kernel.json} with the command line that starts this kernel, {@code interrupt_mode: message}
 * (a SIGINT would end a JVM), and two logo sizes drawn here.
 */
public final class Kernelspec {
    public static final String NAME = KernelIdentity.NAME;
    public static final String DISPLAY_NAME = KernelIdentity.DISPLAY_NAME;

    private Kernelspec() {}

    /**
     * Writes {@code kernelsDir/loopledger/} and returns that directory.
     *
     * @param argv the command line; {@code {connection_file}} is replaced by Jupyter
     */
    public static Path write(Path kernelsDir, List<String> argv) throws IOException {
        Path dir = kernelsDir.resolve(NAME);
        Files.createDirectories(dir);
        JsonObject spec = new JsonObject();
        JsonArray a = new JsonArray();
        argv.forEach(a::add);
        spec.add("argv", a);
        spec.addProperty("display_name", DISPLAY_NAME);
        spec.addProperty("language", KernelIdentity.LANGUAGE);
        spec.addProperty("interrupt_mode", "message");
        spec.add("env", new JsonObject());
        JsonObject metadata = new JsonObject();
        metadata.addProperty("debugger", false);
        spec.add("metadata", metadata);
        Path tmp = dir.resolve("kernel.json.tmp");
        Files.writeString(tmp, new GsonBuilder().setPrettyPrinting().disableHtmlEscaping().create().toJson(spec) + "\n", StandardCharsets.UTF_8);
        Files.move(tmp, dir.resolve("kernel.json"), java.nio.file.StandardCopyOption.REPLACE_EXISTING, java.nio.file.StandardCopyOption.ATOMIC_MOVE);
        ImageIO.write(logo(32), "png", dir.resolve("logo-32x32.png").toFile());
        ImageIO.write(logo(64), "png", dir.resolve("logo-64x64.png").toFile());
        return dir;
    }

    /** The command line of the running JVM for the jar or class path it was started from. */
    public static List<String> argvForThisJvm() {
        String java = Path.of(System.getProperty("java.home"), "bin", "java").toString();
        String cp = System.getProperty("java.class.path");
        List<String> argv = new java.util.ArrayList<>(List.of(java));
        argv.addAll(org.loopledger.kernel.session.SessionOptions.HOST_FLAGS);
        argv.addAll(org.loopledger.kernel.session.ClassDataArchives.useOptions(org.loopledger.kernel.session.ClassDataArchives.HOST));
        argv.addAll(List.of("-cp", absoluteClassPath(cp), "org.loopledger.cli.Main", "kernel", "{connection_file}"));
        return List.copyOf(argv);
    }

    private static String absoluteClassPath(String cp) {
        StringBuilder b = new StringBuilder();
        for (String e : cp.split(java.io.File.pathSeparator)) {
            if (e.isEmpty()) continue;
            if (b.length() > 0) b.append(java.io.File.pathSeparator);
            b.append(Path.of(e).toAbsolutePath().normalize());
        }
        return b.toString();
    }

    /**
     * Our logo: a rounded square in deep teal with a closed loop arrow around a small step response
     * (a feedback loop over a ledger line).
     */
    static BufferedImage logo(int size) {
        BufferedImage img = new BufferedImage(size, size, BufferedImage.TYPE_INT_ARGB);
        Graphics2D g = img.createGraphics();
        try {
            g.setRenderingHint(RenderingHints.KEY_ANTIALIASING, RenderingHints.VALUE_ANTIALIAS_ON);
            g.setRenderingHint(RenderingHints.KEY_STROKE_CONTROL, RenderingHints.VALUE_STROKE_PURE);
            double s = size;
            g.setColor(new Color(0x0E, 0x4D, 0x5C));
            g.fill(new RoundRectangle2D.Double(0, 0, s, s, s * 0.3, s * 0.3));
            g.setColor(new Color(0xF2, 0xB1, 0x34));
            g.setStroke(new BasicStroke((float) (s * 0.07), BasicStroke.CAP_ROUND, BasicStroke.JOIN_ROUND));
            g.draw(new java.awt.geom.Arc2D.Double(s * 0.16, s * 0.16, s * 0.68, s * 0.68, 110, 300, java.awt.geom.Arc2D.OPEN));
            Path2D head = new Path2D.Double();
            double hx = s * 0.5 + Math.cos(Math.toRadians(110)) * s * 0.34;
            double hy = s * 0.5 - Math.sin(Math.toRadians(110)) * s * 0.34;
            head.moveTo(hx + s * 0.10, hy - s * 0.06);
            head.lineTo(hx - s * 0.01, hy);
            head.lineTo(hx + s * 0.08, hy + s * 0.09);
            g.draw(head);
            g.setColor(Color.WHITE);
            g.setStroke(new BasicStroke((float) (s * 0.06), BasicStroke.CAP_ROUND, BasicStroke.JOIN_ROUND));
            Path2D step = new Path2D.Double();
            step.moveTo(s * 0.30, s * 0.64);
            step.lineTo(s * 0.42, s * 0.64);
            step.curveTo(s * 0.46, s * 0.30, s * 0.52, s * 0.38, s * 0.56, s * 0.42);
            step.curveTo(s * 0.60, s * 0.46, s * 0.64, s * 0.40, s * 0.70, s * 0.42);
            g.draw(step);
        } finally {
            g.dispose();
        }
        return img;
    }
}
