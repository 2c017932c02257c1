package dev.fixmod.verify.hardening;

import java.util.ArrayList;
import java.util.List;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import net.jqwik.api.lifecycle.AfterContainer;

/**
 * {@code fixmod demap}: every option given a value it cannot take (non-finite or huge numbers, malformed pairs,
 * formats too wide for a word, unknown names, megabyte strings, constellations of absurd order) must end in one line
 * and exit status 2 with nothing printed on stdout: the report is built before anything is printed.
 */
class DemapHardeningProperties {

    /** The options under attack, each with the base arguments it replaces. */
    static final List<String> OPTIONS = List.of("-c", "--labeling", "--normalization", "--shaping", "--sample",
            "--codes", "--input-format", "--input-rounding", "--n0", "--esn0", "--llr-sign", "--llr", "--metric",
            "--scale-constant", "--scale", "--scaling", "--constant-rounding");

    /** Values no option of demap accepts. */
    static final List<String> HOSTILE = List.of("NaN", "Infinity", "-Infinity", "1e400", "-1e400", "", " ", ",",
            ",,", "1,2,3", "x", "NaN,NaN", "1e400,0", "0,Infinity", "Q99.99", "Q40.40", "UQ-1.5", "Q1.6.7",
            "Q63.0,floor,saturate", "Q4.1,round,saturate", "Q4.1,half-even", "Q4.1,half-even,saturate,extra",
            "../../escape", "/tmp/fixmod-escape", "half up", "x".repeat(100_000), "\u0000", "-",
            "qam1073741824", "psk0", "qam3");

    @Property(tries = 100)
    void hostileOptionValuesAreRejected(@ForAll("option") String option, @ForAll("hostile") String value) {
        List<String> args = new ArrayList<>(List.of("demap"));
        args.addAll(option.equals("-c") ? List.of() : List.of("-c", "qam16"));
        args.addAll(option.equals("--codes") ? List.of() : option.equals("--sample") ? List.of()
                : List.of("--sample", "0.3,-0.7"));
        args.addAll(option.equals("--esn0") ? List.of() : option.equals("--n0") ? List.of() : List.of("--n0", "0.1"));
        args.add(option);
        args.add(value);
        Harness.Outcome o = Harness.run(args.toArray(String[]::new));
        Harness.tally("demap hostile option values").count(o);
        Harness.assertRejected(o);
    }

    @Property(tries = 15)
    void contradictoryOrMissingArgumentsAreRejected(@ForAll("combination") List<String> extra) {
        List<String> args = new ArrayList<>(List.of("demap"));
        args.addAll(extra);
        Harness.Outcome o = Harness.run(args.toArray(String[]::new));
        Harness.tally("demap contradictory arguments").count(o);
        Harness.assertRejected(o);
    }

    @AfterContainer
    static void summary() {
        Harness.printSummaries("demap");
    }

    @Provide
    Arbitrary<String> option() {
        return Arbitraries.of(OPTIONS);
    }

    @Provide
    Arbitrary<String> hostile() {
        return Arbitraries.of(HOSTILE);
    }

    @Provide
    Arbitrary<List<String>> combination() {
        return Arbitraries.of(List.of(), List.of("-c", "qam16"), List.of("-c", "qam16", "--sample", "0,0"),
                List.of("-c", "qam16", "--n0", "1"), List.of("--sample", "0,0", "--n0", "1"),
                List.of("-c", "qam16", "--sample", "0,0", "--codes", "1,1", "--n0", "1"),
                List.of("-c", "qam16", "--sample", "0,0", "--n0", "1", "--esn0", "3"),
                List.of("-c", "qam16", "--sample", "0,0", "--n0", "0"),
                List.of("-c", "qam16", "--sample", "0,0", "--n0", "-1"),
                List.of("-c", "qam16", "--codes", "99999,0", "--n0", "1"),
                List.of("-c", "qam16", "--codes", "0.5,0", "--n0", "1"),
                List.of("-c", "qam16", "--sample", "0,0", "--n0", "1", "--shaping", "-1"),
                List.of("-c", "qam16", "--sample", "0,0", "--n0", "1", "extra-argument"),
                List.of("-c", "qam16", "-c", "qam64", "--sample", "0,0", "--n0", "1"),
                List.of("-c", "qam16", "--sample", "0,0", "--n0", "1", "--no-such-option"));
    }
}
