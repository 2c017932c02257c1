package dev.fixmod.demap;

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
}
