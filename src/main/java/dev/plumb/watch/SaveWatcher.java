package dev.plumb.watch;

import java.io.IOException;
import java.nio.file.ClosedWatchServiceException;
import java.nio.file.FileSystems;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardWatchEventKinds;
import java.nio.file.WatchEvent;
import java.nio.file.WatchKey;
import java.nio.file.WatchService;
import java.util.HashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.concurrent.TimeUnit;

/**
 * Waits for saves of a set of files. It watches the directories that hold them, not the files
 * themselves, because many editors save by writing a new file and renaming it over the old one (or
 * by deleting and re-creating it): a watch on the old file would see it go and nothing after. Every
 * event that names one of the files counts, whatever its kind; the burst of events one save makes
 * (a truncate and a write, a create and a rename) is gathered into one change by waiting until the
 * directory has been quiet for the debounce interval.
 */
public final class SaveWatcher implements AutoCloseable {

    private final WatchService service;
    /** The watched directories, each with the names of the files in it that are asked for. */
    private final Map<Path, Set<String>> namesByDirectory = new HashMap<>();
    private final Map<WatchKey, Path> directories = new HashMap<>();
    private final Map<Path, Path> asGiven = new HashMap<>();
    private final long debounceNanos;
    private final long reappearNanos;

    /**
     * Watches {@code files}; {@code debounceMillis} is how long the directories must be quiet before
     * a change is reported, and a file that is missing then is waited for up to ten times as long (an
     * editor between deleting the old file and writing the new one).
     *
     * @throws IOException when a file's directory cannot be watched (it does not exist, say)
     */
    public SaveWatcher(List<Path> files, long debounceMillis) throws IOException {
        this.service = FileSystems.getDefault().newWatchService();
        this.debounceNanos = TimeUnit.MILLISECONDS.toNanos(debounceMillis);
        this.reappearNanos = 10 * debounceNanos;
        try {
            for (Path f : files) {
                Path absolute = f.toAbsolutePath().normalize();
                Path dir = absolute.getParent();
                asGiven.putIfAbsent(absolute, f);
                if (!namesByDirectory.containsKey(dir)) {
                    WatchKey key = dir.register(service, StandardWatchEventKinds.ENTRY_CREATE,
                            StandardWatchEventKinds.ENTRY_MODIFY, StandardWatchEventKinds.ENTRY_DELETE);
                    directories.put(key, dir);
                }
                namesByDirectory.computeIfAbsent(dir, d -> new LinkedHashSet<>()).add(absolute.getFileName().toString());
            }
        } catch (IOException | RuntimeException e) {
            service.close();
            throw e;
        }
    }

    /**
     * Blocks until at least one of the files is saved and the directories have been quiet for the
     * debounce interval, and returns the files saved (as they were given to the constructor). Throws
     * {@link InterruptedException} when the waiting thread is interrupted.
     */
    public Set<Path> awaitSave() throws InterruptedException {
        Set<Path> changed = new LinkedHashSet<>();
        while (changed.isEmpty()) {
            WatchKey key = take();
            collect(key, changed);
        }
        // Quiet for the debounce interval: every event that arrives restarts the wait.
        long quietSince = System.nanoTime();
        while (System.nanoTime() - quietSince < debounceNanos) {
            long left = debounceNanos - (System.nanoTime() - quietSince);
            WatchKey key = service.poll(Math.max(1, left), TimeUnit.NANOSECONDS);
            if (key != null && collect(key, changed)) quietSince = System.nanoTime();
        }
        awaitReappearance(changed);
        return changed;
    }

    /**
     * An editor that deletes and re-creates the file may not have written the new one yet; a file
     * that stays missing is reported all the same (its check says it is missing).
     */
    private void awaitReappearance(Set<Path> changed) throws InterruptedException {
        long start = System.nanoTime();
        while (changed.stream().anyMatch(p -> !Files.exists(p)) && System.nanoTime() - start < reappearNanos) {
            WatchKey key = service.poll(debounceNanos, TimeUnit.NANOSECONDS);
            if (key != null) collect(key, changed);
        }
    }

    private WatchKey take() throws InterruptedException {
        try {
            return service.take();
        } catch (ClosedWatchServiceException e) {
            throw new InterruptedException("the watch was closed");
        }
    }

    /** Adds the watched files {@code key}'s events name to {@code changed}; true when there were any. */
    private boolean collect(WatchKey key, Set<Path> changed) {
        Path dir = directories.get(key);
        boolean any = false;
        for (WatchEvent<?> event : key.pollEvents()) {
            Set<String> names = namesByDirectory.getOrDefault(dir, Set.of());
            if (event.kind() == StandardWatchEventKinds.OVERFLOW) {
                // Events were lost: any file of the directory may have changed.
                for (String n : names) changed.add(asGiven.get(dir.resolve(n)));
                any |= !names.isEmpty();
            } else if (event.context() instanceof Path name && names.contains(name.toString())) {
                changed.add(asGiven.get(dir.resolve(name.toString())));
                any = true;
            }
        }
        key.reset();
        return any;
    }

    @Override
    public void close() throws IOException {
        service.close();
    }
}
