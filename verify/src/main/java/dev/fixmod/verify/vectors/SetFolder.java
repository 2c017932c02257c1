package dev.fixmod.verify.vectors;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Comparator;
import java.util.stream.Stream;

/**
 * The rules for a set's folder on top of {@link dev.fixmod.verify.formats.OutputSet}'s atomic output: an existing
 * folder is replaced only when asked, and only if it is a vector set or empty, so {@code --force} never deletes an
 * unrelated folder.
 */
public final class SetFolder {

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
