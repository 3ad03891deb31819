package dev.plumb.cli;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.DirectoryStream;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.nio.file.StandardOpenOption;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.regex.Pattern;

/**
 * Replaces a set of documents in a folder as a whole, as nearly as a file system allows: every file
 * is written under a temporary name first, a journal then names the moves that put them in place,
 * and the moves are made one after another. A run stopped by an interrupt or a termination signal
 * finishes the moves it has begun, or removes its temporary files if it has not begun them. A run
 * killed outright (SIGKILL, a power cut) between two moves leaves its journal, and the next report
 * into the folder, whether it writes or not, first finishes those moves: the folder then holds the
 * killed run's complete set. Temporary files are created the ordinary way, so their mode follows
 * the umask.
 */
final class DocumentSet {

    private static final Pattern TEMPORARY = Pattern.compile("\\.plumb-[0-9a-f]+-\\d+\\.tmp");

    private DocumentSet() {
    }

    /** Writes {@code files} (name to content) into {@code dir}, replacing files of the same names. */
    static void replace(Path dir, Map<String, byte[]> files) throws IOException {
        Files.createDirectories(dir);
        recover(dir);
        String run = Long.toHexString(System.nanoTime());
        Map<Path, Path> moves = new LinkedHashMap<>();
        for (String name : files.keySet()) moves.put(dir.resolve(".plumb-" + run + "-" + moves.size() + ".tmp"), dir.resolve(name));
        Path journal = dir.resolve(".plumb-" + run + ".journal");
        Path journalTmp = dir.resolve(".plumb-" + run + "-journal.tmp");
        List<Path> temporaries = new ArrayList<>(moves.keySet());
        temporaries.add(journalTmp);
        Exit exit = new Exit(temporaries);
        Thread hook = new Thread(exit::run, "plumb report: finish or undo");
        Runtime.getRuntime().addShutdownHook(hook);
        try {
            // Each file is written under the lock, so that a stop removes every temporary file, none created after it.
            for (Map.Entry<Path, Path> m : moves.entrySet()) {
                synchronized (exit) {
                    exit.check();
                    Files.write(m.getKey(), files.get(m.getValue().getFileName().toString()), StandardOpenOption.CREATE_NEW);
                }
            }
            StringBuilder lines = new StringBuilder();
            moves.forEach((tmp, target) -> lines.append(tmp.getFileName()).append('\t').append(target.getFileName()).append('\n'));
            synchronized (exit) {
                exit.check();
                Files.writeString(journalTmp, lines, StandardCharsets.UTF_8, StandardOpenOption.CREATE_NEW);
                exit.moving = true;
                move(journalTmp, journal);
                for (Map.Entry<Path, Path> m : moves.entrySet()) move(m.getKey(), m.getValue());
                Files.deleteIfExists(journal);
            }
        } finally {
            for (Path tmp : temporaries) Files.deleteIfExists(tmp);
            try {
                Runtime.getRuntime().removeShutdownHook(hook);
            } catch (IllegalStateException shuttingDown) {
                // The hook runs or has run; nothing to undo.
            }
        }
    }

    /**
     * Finishes the moves a killed run had begun (its journal is whole: it is moved into place only once
     * written), then removes any temporary file a killed run left. Only names of this form are touched.
     */
    static void recover(Path dir) throws IOException {
        if (!Files.isDirectory(dir)) return;
        try (DirectoryStream<Path> journals = Files.newDirectoryStream(dir, ".plumb-*.journal")) {
            for (Path journal : journals) {
                for (String line : Files.readAllLines(journal, StandardCharsets.UTF_8)) {
                    String[] parts = line.split("\t", -1);
                    if (parts.length != 2 || !TEMPORARY.matcher(parts[0]).matches() || !plainName(parts[1])) continue;
                    try {
                        move(dir.resolve(parts[0]), dir.resolve(parts[1]));
                    } catch (NoSuchFileException alreadyMoved) {
                        // moved before the kill
                    }
                }
                Files.deleteIfExists(journal);
            }
        }
        try (DirectoryStream<Path> old = Files.newDirectoryStream(dir, ".plumb-*.tmp")) {
            for (Path leftover : old) Files.deleteIfExists(leftover);
        }
    }

    private static boolean plainName(String name) {
        return !name.isEmpty() && !name.equals(".") && !name.equals("..") && name.indexOf('/') < 0 && name.indexOf('\\') < 0
                && name.indexOf('\0') < 0;
    }

    private static void move(Path from, Path to) throws IOException {
        try {
            Files.move(from, to, StandardCopyOption.REPLACE_EXISTING, StandardCopyOption.ATOMIC_MOVE);
        } catch (AtomicMoveNotSupportedException e) {
            Files.move(from, to, StandardCopyOption.REPLACE_EXISTING);
        }
    }

    /**
     * What the run does when the JVM is asked to stop (an interrupt, a termination signal) while it
     * writes: before the moves, it stops them from starting and removes its temporary files; during
     * them, it waits until they are done (the writer holds this object's lock throughout).
     */
    private static final class Exit {
        private final List<Path> temporaries;
        boolean stopping;
        boolean moving;

        Exit(List<Path> temporaries) {
            this.temporaries = temporaries;
        }

        void check() throws IOException {
            if (stopping) throw new IOException("stopped before the documents were moved into place");
        }

        synchronized void run() {
            stopping = true;
            if (moving) return;
            for (Path tmp : temporaries) {
                try {
                    Files.deleteIfExists(tmp);
                } catch (IOException ignored) {
                    // the JVM is stopping; what cannot be removed now the next run removes
                }
            }
        }
    }
}
