package dev.fixmod.verify.vectors;

import java.io.IOException;
import java.nio.file.DirectoryNotEmptyException;
import java.nio.file.FileAlreadyExistsException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.nio.file.attribute.PosixFileAttributeView;
import java.nio.file.attribute.PosixFilePermissions;
import java.util.Comparator;
import java.util.stream.Stream;

/**
 * Atomic output of a set: everything is written into a hidden temporary folder beside the target, which is then
 * moved into place in one rename. An existing set is replaced only when asked (and only if it is a set or empty);
 * a failed or interrupted run deletes its temporary folder (a shutdown hook covers Ctrl-C), so no partial set is
 * ever visible under the target name.
 */
public final class SetFolder {

    /** Writes the files of a set into an empty folder and returns its manifest. */
    @FunctionalInterface
    public interface Content {
        Manifest writeInto(Path dir) throws IOException;
    }

    private SetFolder() {
    }

    /**
     * Checks up front that {@code target} may be written.
     *
     * @throws IllegalArgumentException if it exists and {@code force} is off, or it is not a set folder
     */
    public static void requireWritable(Path target, boolean force) {
        if (!Files.exists(target)) {
            return;
        }
        if (!force) {
            throw new IllegalArgumentException(target + " already exists; give --force to replace it");
        }
        if (!Files.isDirectory(target)) {
            throw new IllegalArgumentException(target + " exists and is not a folder; not replacing it");
        }
        if (!Files.isRegularFile(target.resolve(Manifest.FILE_NAME)) && !isEmpty(target)) {
            throw new IllegalArgumentException(target + " is a non-empty folder without " + Manifest.FILE_NAME
                    + "; --force replaces vector sets only");
        }
    }

    /** Writes a set atomically at {@code target}. */
    public static Manifest write(Path target, boolean force, Content content) throws IOException {
        requireWritable(target, force);
        Path absolute = target.toAbsolutePath().normalize();
        Path parent = absolute.getParent();
        Files.createDirectories(parent);
        Path temp = Files.createTempDirectory(parent, "." + absolute.getFileName() + ".tmp-");
        // A temporary folder is private (rwx------); the finished set is an ordinary folder.
        if (Files.getFileStore(temp).supportsFileAttributeView(PosixFileAttributeView.class)) {
            Files.setPosixFilePermissions(temp, PosixFilePermissions.fromString("rwxr-xr-x"));
        }
        Thread cleanup = new Thread(() -> deleteQuietly(temp), "fixmod-vectors-cleanup");
        Runtime.getRuntime().addShutdownHook(cleanup);
        try {
            Manifest manifest = content.writeInto(temp);
            if (Files.exists(absolute)) {
                Path old = Files.createTempDirectory(parent, "." + absolute.getFileName() + ".old-");
                Files.delete(old);
                Files.move(absolute, old, StandardCopyOption.ATOMIC_MOVE);
                Files.move(temp, absolute, StandardCopyOption.ATOMIC_MOVE);
                deleteQuietly(old);
            } else {
                try {
                    Files.move(temp, absolute, StandardCopyOption.ATOMIC_MOVE);
                } catch (FileAlreadyExistsException | DirectoryNotEmptyException e) {
                    throw new IllegalArgumentException(target + " appeared while the set was generated; not replacing it");
                }
            }
            return manifest;
        } finally {
            deleteQuietly(temp);
            try {
                Runtime.getRuntime().removeShutdownHook(cleanup);
            } catch (IllegalStateException shuttingDown) {
                // the hook runs anyway
            }
        }
    }

    private static boolean isEmpty(Path dir) {
        try (Stream<Path> s = Files.list(dir)) {
            return s.findAny().isEmpty();
        } catch (IOException e) {
            return false;
        }
    }

    /** Deletes a folder tree if it exists; used on temporary folders only. */
    static void deleteQuietly(Path dir) {
        if (!Files.exists(dir)) {
            return;
        }
        try (Stream<Path> s = Files.walk(dir)) {
            s.sorted(Comparator.reverseOrder()).forEach(p -> {
                try {
                    Files.deleteIfExists(p);
                } catch (IOException ignored) {
                    // best effort: a leftover hidden temp folder is never mistaken for a set
                }
            });
        } catch (IOException ignored) {
            // as above
        }
    }
}
