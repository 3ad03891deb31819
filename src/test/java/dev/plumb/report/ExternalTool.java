package dev.plumb.report;

import java.io.File;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Optional;
import java.util.concurrent.TimeUnit;

/** A program outside the project that a test checks plumb's output with (pdflatex, Chromium, poppler). */
record ExternalTool(Path path) {

    /** The first of the names found on the PATH. */
    static Optional<ExternalTool> find(String... names) {
        String path = System.getenv("PATH");
        if (path == null) return Optional.empty();
        for (String name : names) {
            for (String dir : path.split(File.pathSeparator)) {
                Path p = Path.of(dir, name);
                if (Files.isRegularFile(p) && Files.isExecutable(p)) return Optional.of(new ExternalTool(p));
            }
        }
        return Optional.empty();
    }

    /** What one run printed, standard output and standard error kept apart. */
    record Result(int status, String out, String err) { }

    /**
     * Runs the tool in {@code dir}. The limit only keeps a hung program from hanging the build; it is
     * generous and never part of what is checked.
     */
    Result run(Path dir, List<String> args) throws IOException, InterruptedException {
        List<String> command = new java.util.ArrayList<>();
        command.add(path.toString());
        command.addAll(args);
        Path out = Files.createTempFile(dir, "tool-", ".out"), err = Files.createTempFile(dir, "tool-", ".err");
        Process p = new ProcessBuilder(command).directory(dir.toFile()).redirectInput(ProcessBuilder.Redirect.from(new File("/dev/null")))
                .redirectOutput(out.toFile()).redirectError(err.toFile()).start();
        if (!p.waitFor(15, TimeUnit.MINUTES)) {
            p.destroyForcibly();
            throw new AssertionError(path + " did not finish in 15 minutes");
        }
        Result r = new Result(p.exitValue(), new String(Files.readAllBytes(out), StandardCharsets.UTF_8),
                new String(Files.readAllBytes(err), StandardCharsets.UTF_8));
        Files.delete(out);
        Files.delete(err);
        return r;
    }
}
