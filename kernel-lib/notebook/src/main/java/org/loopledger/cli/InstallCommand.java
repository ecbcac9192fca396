package org.loopledger.cli;

import org.loopledger.kernel.Kernelspec;
import picocli.CommandLine.ArgGroup;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.concurrent.Callable;
import java.util.concurrent.TimeUnit;

/**
 * {@code loopledger install [--user | --prefix DIR | --sys-prefix]}: writes the kernelspec into the
 * Jupyter data directory (user: {@code ~/.local/share/jupyter/kernels}; prefix: {@code DIR/share/jupyter/kernels};
 * sys-prefix: {@code sys.prefix} of {@code /usr/bin/python3} + {@code /share/jupyter/kernels}).
 */
@Command(name = "install", mixinStandardHelpOptions = true, versionProvider = VersionProvider.class, description = "Install the Jupyter kernelspec 'loopledger'.")
final class InstallCommand implements Callable<Integer> {
    static final class Where {
        @Option(names = "--user", description = "into ~/.local/share/jupyter/kernels (default)")
        boolean user;
        @Option(names = "--prefix", paramLabel = "DIR", description = "into DIR/share/jupyter/kernels")
        Path prefix;
        @Option(names = "--sys-prefix", description = "into sys.prefix of /usr/bin/python3 (e.g. /usr/share/jupyter/kernels)")
        boolean sysPrefix;
    }

    @ArgGroup(exclusive = true)
    Where where = new Where();

    @Override
    public Integer call() throws Exception {
        Path kernels;
        if (where.prefix != null) kernels = where.prefix.resolve("share/jupyter/kernels");
        else if (where.sysPrefix) kernels = Path.of(pythonSysPrefix(), "share/jupyter/kernels");
        else kernels = Path.of(System.getProperty("user.home"), ".local/share/jupyter/kernels");
        Path dir = Kernelspec.write(kernels, Kernelspec.argvForThisJvm());
        System.out.println("Installed kernelspec " + Kernelspec.NAME + " in " + dir);
        return 0;
    }

    private static String pythonSysPrefix() throws IOException, InterruptedException {
        Process p = new ProcessBuilder("/usr/bin/python3", "-c", "import sys; print(sys.prefix)").redirectErrorStream(true).start();
        String out = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8).strip();
        if (!p.waitFor(30, TimeUnit.SECONDS) || p.exitValue() != 0 || out.isEmpty()) {
            throw new IOException("cannot ask /usr/bin/python3 for sys.prefix (" + out + "); use --prefix DIR instead");
        }
        return out;
    }
}
