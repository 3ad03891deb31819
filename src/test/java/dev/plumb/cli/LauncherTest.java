package dev.plumb.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.OutputStream;
import java.io.RandomAccessFile;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.FileTime;
import java.nio.file.attribute.PosixFilePermissions;
import java.util.List;
import java.util.Map;
import java.util.Random;
import java.util.concurrent.TimeUnit;
import java.util.jar.Attributes;
import java.util.jar.JarEntry;
import java.util.jar.JarOutputStream;
import java.util.jar.Manifest;
import javax.tools.JavaCompiler;
import javax.tools.ToolProvider;
import org.junit.jupiter.api.Assumptions;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The {@code plumb} launcher at the repository root, run in a project of its own with a stand-in
 * for Maven (it records each build, takes two seconds, and copies in a tiny real jar whose main
 * class prints its arguments) and the real {@code java}. Two launchers started together must build
 * once, both succeed, and keep the log while the build runs; a damaged class-data archive must not
 * make a later run fail.
 */
class LauncherTest {

    @TempDir
    Path dir;

    private Path project;
    private Path record;
    private Path jar;

    @BeforeEach
    void project() throws Exception {
        Assumptions.assumeTrue(onPath("bash") && onPath("flock"), "bash and flock are needed to run the launcher as users do");
        project = Files.createDirectories(dir.resolve("project"));
        Files.copy(Path.of("plumb"), project.resolve("plumb"));
        Files.setPosixFilePermissions(project.resolve("plumb"), PosixFilePermissions.fromString("rwxr-xr-x"));
        Files.writeString(project.resolve("pom.xml"), "<project/>\n");
        Files.createDirectories(project.resolve("src/main"));
        Files.writeString(project.resolve("src/main/Placeholder.java"), "class Placeholder { }\n");
        Files.createDirectories(project.resolve("derivations"));
        Files.writeString(project.resolve("derivations/uniform-sphere.plumb"), "# the launcher trains its class-data archive on this\n");
        // Sources must be older than the jar the stand-in build writes, as they are after a real build.
        FileTime past = FileTime.fromMillis(System.currentTimeMillis() - 60_000);
        for (String p : List.of("pom.xml", "src/main/Placeholder.java", "src/main")) Files.setLastModifiedTime(project.resolve(p), past);

        jar = tinyJar(dir.resolve("built.jar"));
        record = dir.resolve("builds.txt");
        Path bin = Files.createDirectories(dir.resolve("bin"));
        Path mvn = bin.resolve("mvn");
        Files.writeString(mvn, """
                #!/usr/bin/env bash
                # Stand-in for Maven: records the build, takes a while, checks its log is still there, writes the jar.
                echo "build $$ $*" >>"$FAKE_MVN_RECORD"
                sleep "${FAKE_MVN_SECONDS:-0}"
                if [ -e target-build.log ]; then echo "log kept" >>"$FAKE_MVN_RECORD"; else echo "log lost" >>"$FAKE_MVN_RECORD"; fi
                mkdir -p target
                cp "$FAKE_MVN_JAR" target/plumb.jar.part && mv target/plumb.jar.part target/plumb.jar
                """);
        Files.setPosixFilePermissions(mvn, PosixFilePermissions.fromString("rwxr-xr-x"));
    }

    @Test
    void twoLaunchersStartedTogetherBuildOnceAndBothRun() throws Exception {
        Process first = launcher(2, "check", "first.plumb");
        Process second = launcher(2, "check", "second.plumb");
        assertTrue(first.waitFor(120, TimeUnit.SECONDS) && second.waitFor(120, TimeUnit.SECONDS), "a launcher did not end in 120 s");
        String out1 = output(first), out2 = output(second);
        assertEquals(0, first.exitValue(), out1);
        assertEquals(0, second.exitValue(), out2);
        assertTrue(out1.contains("stand-in plumb: check first.plumb"), out1);
        assertTrue(out2.contains("stand-in plumb: check second.plumb"), out2);

        List<String> builds = Files.readAllLines(record);
        assertEquals(1, builds.stream().filter(l -> l.startsWith("build ")).count(), builds::toString);
        assertEquals(List.of("log kept"), builds.stream().filter(l -> l.startsWith("log ")).toList(), "the build's log was removed under it");
        assertEquals(1, (out1 + out2).split("plumb: building", -1).length - 1, "exactly one launcher says it builds: " + out1 + out2);
        assertTrue(Files.isRegularFile(project.resolve("target/plumb.jar")));
    }

    @Test
    void aDamagedOrStaleClassDataArchiveIsMadeAgainNotMapped() throws Exception {
        Path archive = project.resolve("target/plumb.jsa");
        run("first run");
        assertTrue(Files.size(archive) > 0, "the first run makes the archive");

        // Truncated: mapped as it is, the JVM would die with SIGBUS (seen on JDK 17). The JVM writes it read-only.
        Files.setPosixFilePermissions(archive, PosixFilePermissions.fromString("rw-r--r--"));
        try (RandomAccessFile f = new RandomAccessFile(archive.toFile(), "rw")) {
            f.setLength(f.length() / 2);
        }
        run("after truncation");
        assertEquals(Files.readString(project.resolve("target/plumb.jsa.size")).strip(), Long.toString(Files.size(archive)),
                "a whole archive, made again");

        // Garbage of the right size: the JVM's own header check refuses it, and the run goes on without it.
        byte[] garbage = new byte[(int) Files.size(archive)];
        new Random(7).nextBytes(garbage);
        FileTime stamp = Files.getLastModifiedTime(archive);
        Files.setPosixFilePermissions(archive, PosixFilePermissions.fromString("rw-r--r--"));
        Files.write(archive, garbage);
        Files.setLastModifiedTime(archive, stamp);
        run("with garbage");

        // Older than the jar: made from another build, so made again.
        Path built = project.resolve("target/plumb.jar");
        Files.setLastModifiedTime(archive, FileTime.fromMillis(Files.getLastModifiedTime(built).toMillis() - 10_000));
        run("when stale");
        assertTrue(Files.getLastModifiedTime(archive).compareTo(Files.getLastModifiedTime(built)) > 0, "the stale archive is made again");
    }

    private void run(String when) throws Exception {
        Process p = launcher(0, "check", "x.plumb");
        assertTrue(p.waitFor(120, TimeUnit.SECONDS), when + ": the launcher did not end in 120 s");
        String out = output(p);
        assertEquals(0, p.exitValue(), when + ": " + out);
        assertTrue(out.contains("stand-in plumb: check x.plumb"), when + ": " + out);
        assertFalse(out.contains("fatal error") || out.contains("SIGBUS"), when + ": " + out);
    }

    private Process launcher(int buildSeconds, String... args) throws IOException {
        List<String> command = new java.util.ArrayList<>(List.of("bash", project.resolve("plumb").toString()));
        command.addAll(List.of(args));
        ProcessBuilder pb = new ProcessBuilder(command).directory(dir.toFile()).redirectErrorStream(true)
                .redirectOutput(dir.resolve("out-" + System.nanoTime() + ".txt").toFile());
        Map<String, String> env = pb.environment();
        String javaBin = Path.of(System.getProperty("java.home"), "bin").toString();
        env.put("PATH", dir.resolve("bin") + ":" + javaBin + ":" + env.getOrDefault("PATH", "/usr/bin:/bin"));
        env.put("FAKE_MVN_RECORD", record.toString());
        env.put("FAKE_MVN_JAR", jar.toString());
        env.put("FAKE_MVN_SECONDS", Integer.toString(buildSeconds));
        env.remove("PLUMB_NO_CDS");
        env.put("PLUMB_NO_AOT", "1"); // the Java 17 path with its class-data archive, whatever other JDK is present
        Process p = pb.start();
        outputs.put(p, pb.redirectOutput().file().toPath());
        return p;
    }

    private final Map<Process, Path> outputs = new java.util.HashMap<>();

    private String output(Process p) throws IOException {
        return Files.readString(outputs.get(p), StandardCharsets.UTF_8);
    }

    /** A jar whose main class prints its arguments: enough for the launcher, and real for the JVM's class-data sharing. */
    private static Path tinyJar(Path jar) throws IOException {
        Path src = Files.createDirectories(jar.resolveSibling("stand-in-src")).resolve("StandIn.java");
        Files.writeString(src, """
                public class StandIn {
                    public static void main(String[] args) {
                        System.out.println("stand-in plumb: " + String.join(" ", args));
                    }
                }
                """);
        JavaCompiler javac = ToolProvider.getSystemJavaCompiler();
        Assumptions.assumeTrue(javac != null, "a JDK (with javac) runs the tests");
        assertEquals(0, javac.run(null, null, null, "-d", src.getParent().toString(), src.toString()));
        Manifest manifest = new Manifest();
        manifest.getMainAttributes().put(Attributes.Name.MANIFEST_VERSION, "1.0");
        manifest.getMainAttributes().put(Attributes.Name.MAIN_CLASS, "StandIn");
        try (OutputStream file = Files.newOutputStream(jar); JarOutputStream out = new JarOutputStream(file, manifest)) {
            out.putNextEntry(new JarEntry("StandIn.class"));
            out.write(Files.readAllBytes(src.resolveSibling("StandIn.class")));
            out.closeEntry();
        }
        return jar;
    }

    private static boolean onPath(String tool) {
        try {
            Process p = new ProcessBuilder("bash", "-c", "command -v " + tool).redirectErrorStream(true).start();
            return p.waitFor(10, TimeUnit.SECONDS) && p.exitValue() == 0;
        } catch (IOException | InterruptedException e) {
            return false;
        }
    }
}
