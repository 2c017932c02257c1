package dev.fixmod.verify.compare;

import java.io.Closeable;
import java.util.List;

/**
 * The corner-case flags of each golden vector, asked for in increasing index order so that an implementation can
 * stream them from a file. A vector's flags are a bit set over {@link #names()} (bit i = names().get(i)).
 */
public interface VectorFlags extends Closeable {
    /** The flag glossary, at most 64 names; a null entry is a bit without a name. */
    List<String> names();

    /** The flags of vector {@code index}; called with non-decreasing indices. */
    long flagsOf(long index);

    /** Releases the file behind the flags, if any. */
    @Override
    default void close() {
    }

    /** No vector carries a flag. */
    VectorFlags NONE = new VectorFlags() {
        @Override
        public List<String> names() {
            return List.of();
        }

        @Override
        public long flagsOf(long index) {
            return 0;
        }
    };

    /** The bit set of the given names; unknown names are a usage error listing the glossary. */
    default long maskOf(List<String> wanted) {
        long mask = 0;
        for (String w : wanted) {
            int i = names().indexOf(w);
            if (i < 0) {
                throw new IllegalArgumentException("unknown corner-case flag '" + w + "'; this set's flags are "
                        + (names().stream().allMatch(java.util.Objects::isNull) ? "(none)"
                        : String.join(", ", names().stream().filter(java.util.Objects::nonNull).toList())));
            }
            mask |= 1L << i;
        }
        return mask;
    }
}
