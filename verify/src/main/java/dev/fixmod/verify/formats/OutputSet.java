package dev.fixmod.verify.formats;

import java.io.Closeable;
import java.io.IOException;
import java.io.OutputStream;
import java.io.UncheckedIOException;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.FileVisitResult;
import java.nio.file.Files;
import java.nio.file.LinkOption;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.nio.file.SimpleFileVisitor;
import java.nio.file.StandardCopyOption;
import java.nio.file.StandardOpenOption;
import java.nio.file.attribute.BasicFileAttributes;
import java.util.Collections;
import java.util.HashSet;
import java.util.Map;
import java.util.Set;
import java.util.TreeMap;
import java.util.TreeSet;

/**
 * Writes a whole set of files into a hidden work folder next to the target folder and moves it into place only on
 * {@link #commit()}, so the target either does not exist or is complete: a failure, an exception from the producer,
 * or the JVM being stopped (shutdown hook) deletes the work folder. Every file's SHA-256 is computed while it is
 * written.
 *
 * <pre>{@code
 * try (OutputSet set = OutputSet.create(target, force)) {
 *     try (RowWriter w = FileFormat.HEX.open(table, set.newFile("tx/symbols.hex"))) { ... }
 *     Map<String, String> digests = set.sha256();   // for the manifest
 *     ...
 *     set.commit();
 * }
 * }</pre>
 *
 * <table class="striped">
 *   <caption>File names inside a set</caption>
 *   <thead><tr><th>name</th><th>result</th></tr></thead>
 *   <tbody>
 *     <tr><td>{@code symbols.hex}, {@code tx/symbols.hex}</td><td>accepted</td></tr>
 *     <tr><td>{@code ../x.hex}, {@code a/../../x}, {@code /tmp/x}, {@code a\x}, {@code ./x}, empty</td>
 *         <td>IllegalArgumentException</td></tr>
 *     <tr><td>a name given twice</td><td>IllegalArgumentException</td></tr>
 *   </tbody>
 * </table>
 *
 * <p>The final move is an atomic rename within the target's parent folder. Replacing an existing target
 * ({@code force}) first renames the old folder aside, then renames the new one into place, then deletes the old
 * one; a crash between the two renames leaves the old set beside, never a mixture.
 */
public final class OutputSet implements Closeable {

    private final Path target;
    private final boolean force;
    private final Path work;
    private final Thread cleanup;
    private final Map<String, String> digests = new TreeMap<>();
    private final Set<String> open = new HashSet<>();
    private boolean finished;

    private OutputSet(Path target, boolean force, Path work) {
        this.target = target;
        this.force = force;
        this.work = work;
        this.cleanup = new Thread(this::discard, "fixmod-output-set-cleanup");
        Runtime.getRuntime().addShutdownHook(cleanup);
    }

    /**
     * Starts a set that {@link #commit()} will move to {@code target}.
     *
     * @param force whether an existing target folder may be replaced
     * @throws IllegalArgumentException if the target exists (and {@code force} is off) or is not a folder
     */
    public static OutputSet create(Path target, boolean force) throws IOException {
        Path absolute = target.toAbsolutePath().normalize();
        Path parent = absolute.getParent();
        if (parent == null) {
            throw new IllegalArgumentException("output folder " + target + " has no parent folder to work in");
        }
        checkTarget(absolute, force);
        Files.createDirectories(parent);
        Path work = Files.createTempDirectory(parent, "." + absolute.getFileName() + ".partial-");
        return new OutputSet(absolute, force, work);
    }

    private static void checkTarget(Path target, boolean force) {
        if (Files.exists(target, LinkOption.NOFOLLOW_LINKS)) {
            if (!Files.isDirectory(target, LinkOption.NOFOLLOW_LINKS)) {
                throw new IllegalArgumentException("output folder " + target + " exists and is not a folder;"
                        + " choose another output folder");
            }
            if (!force) {
                throw new IllegalArgumentException("output folder " + target + " already exists; choose another"
                        + " folder or allow overwriting it (force)");
            }
        }
    }

    /** The folder the set will have after {@link #commit()}. */
    public Path target() {
        return target;
    }

    /** The hidden folder the files are written into until {@link #commit()}. */
    public Path workFolder() {
        return work;
    }

    /**
     * A new file of the set, e.g. {@code tx/symbols.hex}; its SHA-256 is known once the stream is closed.
     *
     * @throws IllegalArgumentException if the name could leave the set folder or was given before
     */
    public synchronized OutputStream newFile(String relativeName) throws IOException {
        if (finished) {
            throw new IllegalStateException("vector set " + target + " is already committed or closed");
        }
        Path path = resolve(relativeName);
        String key = work.relativize(path).toString().replace('\\', '/');
        if (digests.containsKey(key) || open.contains(key)) {
            throw new IllegalArgumentException("file " + key + " is written twice in vector set " + target);
        }
        Files.createDirectories(path.getParent());
        OutputStream out = Files.newOutputStream(path, StandardOpenOption.CREATE_NEW, StandardOpenOption.WRITE);
        open.add(key);
        return new HashingOutputStream(out, digest -> closed(key, digest));
    }

    private synchronized void closed(String key, String digest) {
        open.remove(key);
        digests.put(key, digest);
    }

    private Path resolve(String name) {
        String rule = " inside the vector set must be a relative path that stays in the set folder (no '..',"
                + " no '.', no leading '/', no '\\'), e.g. tx/symbols.hex";
        if (name == null || name.isEmpty() || name.contains("\\")) {
            throw new IllegalArgumentException("file name '" + name + "'" + rule);
        }
        Path p;
        try {
            p = work.getFileSystem().getPath(name);
        } catch (java.nio.file.InvalidPathException e) {
            throw new IllegalArgumentException("file name '" + name + "'" + rule, e);
        }
        if (p.isAbsolute() || p.getRoot() != null) {
            throw new IllegalArgumentException("file name '" + name + "'" + rule);
        }
        for (Path element : p) {
            String e = element.toString();
            if (e.equals("..") || e.equals(".") || e.isEmpty()) {
                throw new IllegalArgumentException("file name '" + name + "'" + rule);
            }
        }
        Path resolved = work.resolve(p).normalize();
        if (!resolved.startsWith(work) || resolved.equals(work)) {
            throw new IllegalArgumentException("file name '" + name + "'" + rule);
        }
        return resolved;
    }

    /** SHA-256 (lowercase hex) of every closed file, by relative name ('/' separated), sorted by name. */
    public synchronized Map<String, String> sha256() {
        return Collections.unmodifiableMap(new TreeMap<>(digests));
    }

    /** SHA-256 of the closed file {@code relativeName}. */
    public synchronized String sha256(String relativeName) {
        String d = digests.get(relativeName);
        if (d == null) {
            throw new IllegalArgumentException("file " + relativeName + " of vector set " + target
                    + (open.contains(relativeName) ? " is still open" : " was not written"));
        }
        return d;
    }

    /**
     * Moves the finished set into place.
     *
     * @throws IllegalStateException    if a file is still open
     * @throws IllegalArgumentException if the target appeared meanwhile and {@code force} is off
     */
    public synchronized void commit() throws IOException {
        if (finished) {
            throw new IllegalStateException("vector set " + target + " is already committed or closed");
        }
        if (!open.isEmpty()) {
            throw new IllegalStateException("vector set " + target + ": close these files before committing: "
                    + new TreeSet<>(open));
        }
        checkTarget(target, force);
        Path old = null;
        if (Files.exists(target, LinkOption.NOFOLLOW_LINKS)) {
            old = Files.createTempDirectory(target.getParent(), "." + target.getFileName() + ".replaced-");
            move(target, old.resolve("set"));
        }
        try {
            move(work, target);
        } catch (IOException | RuntimeException e) {
            if (old != null) {
                move(old.resolve("set"), target);
                deleteTree(old);
            }
            throw e;
        }
        finished = true;
        removeHook();
        if (old != null) {
            deleteTree(old);
        }
    }

    private static void move(Path from, Path to) throws IOException {
        try {
            Files.move(from, to, StandardCopyOption.ATOMIC_MOVE);
        } catch (AtomicMoveNotSupportedException e) {
            Files.move(from, to);
        }
    }

    /** Deletes the work folder unless the set was committed. */
    @Override
    public synchronized void close() throws IOException {
        if (!finished) {
            finished = true;
            removeHook();
            deleteTree(work);
        }
    }

    private void removeHook() {
        try {
            Runtime.getRuntime().removeShutdownHook(cleanup);
        } catch (IllegalStateException e) {
            // The JVM is shutting down and the hook is running or has run; it does the same cleanup.
        }
    }

    /** The shutdown hook's job. */
    private void discard() {
        synchronized (this) {
            if (finished) {
                return;
            }
            finished = true;
        }
        try {
            deleteTree(work);
        } catch (IOException e) {
            throw new UncheckedIOException("could not delete unfinished vector set " + work, e);
        }
    }

    static void deleteTree(Path root) throws IOException {
        try {
            Files.walkFileTree(root, new SimpleFileVisitor<>() {
                @Override
                public FileVisitResult visitFile(Path file, BasicFileAttributes attrs) throws IOException {
                    Files.delete(file);
                    return FileVisitResult.CONTINUE;
                }

                @Override
                public FileVisitResult postVisitDirectory(Path dir, IOException e) throws IOException {
                    if (e != null) {
                        throw e;
                    }
                    Files.delete(dir);
                    return FileVisitResult.CONTINUE;
                }
            });
        } catch (NoSuchFileException e) {
            // Already gone: nothing left to clean.
        }
    }
}
