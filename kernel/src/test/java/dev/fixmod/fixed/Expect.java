package dev.fixmod.fixed;

import static org.junit.jupiter.api.Assertions.fail;

import java.util.ArrayList;
import java.util.List;
import java.util.function.Supplier;

/** Comparison of a model result with the oracle, the message built only on failure. */
final class Expect {
    private Expect() {
    }

    /** Fails unless the model returned the oracle's code and recorded exactly the oracle's events. */
    static void same(Oracle.Result expected, long code, long events, Supplier<String> what) {
        long expectedEvents = expected.event() ? 1 : 0;
        if (code != expected.code() || events != expectedEvents) {
            fail(what.get() + ": expected code " + expected.code() + " with " + expectedEvents + " event(s), got "
                    + code + " with " + events);
        }
    }

    /** Every format of the given word length: signed Qm.n and unsigned UQm.n, all splits. */
    static List<QFormat> formatsOfWord(int wordLength) {
        List<QFormat> formats = new ArrayList<>();
        for (int n = 0; n <= wordLength - 1; n++) {
            formats.add(QFormat.signedWord(wordLength, n));
        }
        for (int n = 0; n <= wordLength; n++) {
            formats.add(QFormat.unsignedWord(wordLength, n));
        }
        return formats;
    }
}
