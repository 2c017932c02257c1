package dev.fixmod.verify.vectors;

import java.util.Arrays;
import java.util.Locale;
import java.util.stream.Collectors;

/** The closed sets of names a specification uses; each constant has the trade name written in files. */
interface TradeNamed {
    String tradeName();

    /** The constant of {@code type} named {@code name} (case-insensitive, {@code _} for {@code -}), or null. */
    static <E extends Enum<E> & TradeNamed> E find(Class<E> type, String name) {
        String key = name.trim().toLowerCase(Locale.ROOT).replace('_', '-');
        for (E e : type.getEnumConstants()) {
            if (e.tradeName().equals(key)) {
                return e;
            }
        }
        return null;
    }

    /** The accepted names of {@code type}, comma separated. */
    static <E extends Enum<E> & TradeNamed> String names(Class<E> type) {
        return Arrays.stream(type.getEnumConstants()).map(TradeNamed::tradeName).collect(Collectors.joining(", "));
    }
}
