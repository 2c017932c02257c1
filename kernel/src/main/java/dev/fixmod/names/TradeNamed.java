package dev.fixmod.names;

import java.util.Arrays;
import java.util.Locale;
import java.util.stream.Collectors;

/**
 * An enum constant with the name written on the command line, in specification files and in reports, e.g.
 * {@code half-up}. Lookup is case-insensitive and accepts {@code _} for {@code -}, so {@code HALF_UP} and
 * {@code half-up} name the same constant.
 */
public interface TradeNamed {

    /** The name used on the command line, in specification files and in reports. */
    String tradeName();

    /** The constant of {@code type} with the given trade name, or {@code null} if there is none. */
    static <E extends Enum<E> & TradeNamed> E find(Class<E> type, String name) {
        if (name == null) {
            return null;
        }
        String key = name.trim().toLowerCase(Locale.ROOT).replace('_', '-');
        for (E constant : type.getEnumConstants()) {
            if (constant.tradeName().equals(key)) {
                return constant;
            }
        }
        return null;
    }

    /**
     * The constant of {@code type} with the given trade name.
     *
     * @param what the idea in words for the message, e.g. {@code rounding}
     * @throws IllegalArgumentException {@code unknown rounding 'x'; expected one of floor, ceil, ...}
     */
    static <E extends Enum<E> & TradeNamed> E parse(Class<E> type, String name, String what) {
        E found = find(type, name);
        if (found == null) {
            throw new IllegalArgumentException("unknown " + what + " '" + name + "'; expected one of " + names(type));
        }
        return found;
    }

    /** The trade names of {@code type} in declaration order, comma separated. */
    static <E extends Enum<E> & TradeNamed> String names(Class<E> type) {
        return Arrays.stream(type.getEnumConstants()).map(TradeNamed::tradeName).collect(Collectors.joining(", "));
    }
}
