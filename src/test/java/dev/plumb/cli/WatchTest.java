package dev.plumb.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assertions.fail;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.util.concurrent.CompletableFuture;
import java.util.concurrent.TimeUnit;
import java.util.function.Supplier;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * {@code plumb check --watch}, run in this process on a file in a temporary directory: the file is
 * saved the way editors do (written over in place, and written beside and renamed over the old
 * one), and each save's check appears after the one before. The waits bound a run that would
 * otherwise hang; they assert nothing about speed.
 */
class WatchTest {

    private static final long WAIT_SECONDS = 300;

    @TempDir
    Path dir;

    private static void await(String what, Supplier<String> text, String wanted) throws InterruptedException {
        long end = System.nanoTime() + TimeUnit.SECONDS.toNanos(WAIT_SECONDS);
        while (System.nanoTime() < end) {
            if (text.get().contains(wanted)) return;
            Thread.sleep(50);
        }
        fail("never saw " + what + " ('" + wanted + "'); output so far:\n" + text.get());
    }

    @Test
    void eachSaveIsCheckedAgainWhetherWrittenInPlaceOrRenamedOverTheFile() throws Exception {
        String sphere = Files.readString(Path.of("derivations/uniform-sphere.plumb"));
        String wrong = sphere.replace("rho/r^2", "rho/r");
        assertFalse(wrong.equals(sphere));
        Path file = dir.resolve("sphere.plumb");
        Files.writeString(file, wrong);

        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        CompletableFuture<Integer> watching = new CompletableFuture<>();
        Thread watcher = new Thread(() -> watching.complete(
                Main.run(new String[] {"check", "--watch", "--no-color", file.toString()}, new PrintWriter(out, true), new PrintWriter(err, true))));
        watcher.start();
        try {
            await("the first check", out::toString, "--- checked in");
            assertTrue(out.toString().startsWith("=== "), out.toString());
            assertTrue(out.toString().contains("check 1: " + file), out.toString());
            assertTrue(err.toString().contains(file + ":11:27: error: the two sides of relation 'balance' have different units"), err.toString());

            // Saved as many editors do: the new text written beside the file, then renamed over it.
            Path beside = dir.resolve(".sphere.plumb.swp");
            Files.writeString(beside, sphere);
            Files.move(beside, file, StandardCopyOption.REPLACE_EXISTING, StandardCopyOption.ATOMIC_MOVE);
            await("the check after a save by rename", out::toString, "check 2: " + file);
            await("the results of the second check", () -> after(out.toString(), "check 2: "), "--- checked in");
            String second = after(out.toString(), "check 2: ");
            assertTrue(second.contains("claim     central                holds"), second);
            assertTrue(second.contains("11 hold, 0 fail, 0 undecided"), second);

            // Saved in place, with the mistake back.
            Files.writeString(file, wrong);
            await("the check after a save in place", out::toString, "check 3: " + file);
            await("the results of the third check", () -> after(out.toString(), "check 3: "), "--- checked in");
            assertEquals(2, count(err.toString(), ":11:27: error: the two sides of relation 'balance' have different units"), err.toString());
            assertFalse(out.toString().contains("check 4:"), "one save is one check:\n" + out);
        } finally {
            watcher.interrupt();
        }
        assertEquals(1, watching.get(WAIT_SECONDS, TimeUnit.SECONDS), "the status of the last check: a unit check fails");
        assertFalse(err.toString().contains("Exception"), err.toString());
    }

    @Test
    void standardInputCannotBeWatched() {
        Run run = Run.of("check", "--watch", "-");
        assertEquals(2, run.status(), run::all);
        assertTrue(run.err().contains("standard input ('-') cannot be watched"), run.err());
    }

    private static String after(String text, String marker) {
        int i = text.indexOf(marker);
        return i < 0 ? "" : text.substring(i);
    }

    private static int count(String text, String part) {
        int n = 0;
        for (int i = text.indexOf(part); i >= 0; i = text.indexOf(part, i + 1)) n++;
        return n;
    }
}
