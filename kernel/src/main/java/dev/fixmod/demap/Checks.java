package dev.fixmod.demap;

import dev.fixmod.constellation.Constellation;
import dev.fixmod.fixed.QFormat;

/** Argument checks shared by the demappers; every message names what is wrong, where, and what is accepted. */
final class Checks {
    private Checks() {
    }

    /** Checks that {@code [offset, offset + count)} lies in an array of {@code length} named {@code what}. */
    static void range(String what, int length, int offset, int count) {
        if (offset < 0 || count < 0 || offset > length - count) {
            throw new IllegalArgumentException(what + ": offset " + offset + " and count " + count
                    + " do not fit an array of length " + length);
        }
    }

    static void notNull(Object array, String what) {
        if (array == null) {
            throw new IllegalArgumentException(what + " array is missing (null)");
        }
    }

    /** The message of a sample that is not a finite number. */
    static IllegalArgumentException notFinite(String axis, int index, double value) {
        return new IllegalArgumentException("received sample " + axis + " at index " + index + " is " + value
                + "; samples must be finite numbers");
    }

    /** The message of a code outside its format. */
    static IllegalArgumentException codeOutside(String axis, int index, int code, QFormat format) {
        return new IllegalArgumentException("received " + axis + " code " + code + " at index " + index
                + " is outside " + format + " (codes " + format.minCode() + " … " + format.maxCode() + ")");
    }

    /**
     * Refuses the per-axis algorithms for π/2-BPSK: its quarter turn moves the bit from one axis to the other (and
     * 3GPP's points lie on the diagonal, carrying the bit on both), so no axis layout exists. With two points,
     * max-log and log-MAP are the same function of the sample and cheap.
     */
    static void requireAxisFreeForQuarterTurn(SoftAlgorithm algorithm, Constellation constellation) {
        if (constellation.alternatesQuarterTurn()
                && (algorithm == SoftAlgorithm.MAX_LOG_PER_AXIS || algorithm == SoftAlgorithm.FOLDED_LINEAR)) {
            throw new IllegalArgumentException(algorithm + " needs a separable constellation, and "
                    + constellation.name() + " is not: it turns odd-index symbols by +90°, which moves its bit from"
                    + " one axis to the other; use max-log (exact for two points) or log-map");
        }
    }

    /** The message of a π/2-BPSK call without the stream index that decides each symbol's turn. */
    static IllegalArgumentException streamIndexNeeded(Constellation constellation) {
        return new IllegalArgumentException(constellation.name() + " turns odd-index symbols by +90°: call the"
                + " method that takes the stream index of the (first) symbol, so that each one is demapped with its"
                + " own parity");
    }
}
