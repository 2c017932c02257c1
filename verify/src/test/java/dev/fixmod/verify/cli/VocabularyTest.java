package dev.fixmod.verify.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assertions.fail;

import dev.fixmod.fixed.Overflow;
import dev.fixmod.fixed.Rounding;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.TreeMap;
import java.util.TreeSet;
import org.junit.jupiter.api.Test;
import picocli.CommandLine.Model.OptionSpec;

/**
 * One word per idea across every command: the table below names each shared idea, the option that says it, and the
 * synonyms that must not appear anywhere. An option name used by several commands must mean the same thing in each
 * (same aliases, same kind of value). Options whose name says rounding or overflow take the kernel's trade names.
 */
class VocabularyTest {

    /** A shared idea: its options (all aliases), the kind of value, and the spellings that are banned. */
    record Idea(String idea, List<String> names, Class<?> type, List<String> synonyms) {
    }

    static final List<Idea> IDEAS = List.of(
            new Idea("output folder", List.of("-o", "--output"), Path.class,
                    List.of("--out", "--output-dir", "--outdir", "--out-dir", "--dest", "--destination", "--folder",
                            "--target", "-O")),
            new Idea("replace existing output", List.of("--force"), boolean.class,
                    List.of("--overwrite", "--replace", "--clobber", "-f", "-F")),
            new Idea("machine-readable output", List.of("--json"), boolean.class,
                    List.of("--json-output", "--as-json", "--to-json", "--output-json", "-j", "--machine")),
            new Idea("less output", List.of("-q", "--quiet"), boolean.class,
                    List.of("--silent", "-s", "--no-output", "--terse", "--brief")),
            new Idea("random seed", List.of("--seed"), null,
                    List.of("--random-seed", "--rng-seed", "--rng", "--key")),
            new Idea("worker threads", List.of("--threads"), int.class,
                    List.of("--jobs", "-j", "--parallel", "--parallelism", "--workers", "--cores")),
            new Idea("constellation labeling", List.of("--labeling"), null,
                    List.of("--labelling", "--label-map", "--mapping", "--bit-mapping")),
            new Idea("energy normalization", List.of("--normalization"), null,
                    List.of("--normalisation", "--norm", "--scale-energy")),
            new Idea("LLR sign convention", List.of("--llr-sign"), null,
                    List.of("--sign", "--polarity", "--llr-polarity", "--invert-llr")),
            new Idea("rounding mode", List.of("--rounding"), null,
                    List.of("--round", "--rounding-mode", "--rnd", "--quantization")),
            new Idea("overflow mode", List.of("--overflow"), null,
                    List.of("--saturation", "--overflow-mode", "--saturate", "--wrap", "--clip")),
            new Idea("Es/N0 in dB", List.of("--esn0"), null,
                    List.of("--es-n0", "--snr", "--snr-db", "--esno", "--es-no")),
            new Idea("complex noise power", List.of("--n0"), null,
                    List.of("--noise", "--noise-power", "--sigma2", "--variance")));

    /** Every option of every command: long or short name to the commands and specs using it. */
    static Map<String, List<Use>> uses() {
        Map<String, List<Use>> map = new TreeMap<>();
        for (List<String> words : CliContractTest.commands()) {
            for (OptionSpec o : CliContractTest.specOf(words).options()) {
                for (String n : o.names()) {
                    map.computeIfAbsent(n, k -> new ArrayList<>()).add(new Use(CliContractTest.label(words), o));
                }
            }
        }
        return map;
    }

    record Use(String command, OptionSpec option) {
    }

    @Test
    void noSynonymOfASharedIdea() {
        Map<String, List<Use>> uses = uses();
        List<String> problems = new ArrayList<>();
        for (Idea idea : IDEAS) {
            for (String s : idea.synonyms()) {
                if (uses.containsKey(s)) {
                    problems.add(s + " (" + commandsOf(uses.get(s)) + ") is a synonym of " + idea.names()
                            + " for the idea '" + idea.idea() + "'");
                }
            }
            for (String n : idea.names()) {
                for (Use u : uses.getOrDefault(n, List.of())) {
                    if (!Arrays.asList(u.option().names()).containsAll(idea.names())) {
                        problems.add(u.command() + ": " + Arrays.toString(u.option().names()) + " should be "
                                + idea.names());
                    }
                    if (idea.type() != null && u.option().type() != idea.type()) {
                        problems.add(u.command() + ": " + n + " takes " + u.option().type().getSimpleName()
                                + "; '" + idea.idea() + "' takes " + idea.type().getSimpleName()
                                + " in every command");
                    }
                }
            }
        }
        if (!problems.isEmpty()) {
            fail(String.join("\n", problems));
        }
    }

    @Test
    void theSynonymTableIsConsistent() {
        Set<String> names = new TreeSet<>();
        for (Idea idea : IDEAS) {
            for (String n : idea.names()) {
                assertTrue(names.add(n), n + " listed for two ideas");
            }
        }
        for (Idea idea : IDEAS) {
            for (String s : idea.synonyms()) {
                assertTrue(!names.contains(s), s + " is both a name and a synonym");
            }
        }
    }

    @Test
    void aNameSharedByCommandsMeansTheSameInEach() {
        List<String> problems = new ArrayList<>();
        for (Map.Entry<String, List<Use>> e : uses().entrySet()) {
            List<Use> list = e.getValue();
            if (e.getKey().equals("-h") || e.getKey().equals("--help") || e.getKey().equals("-V")
                    || e.getKey().equals("--version")) {
                continue;
            }
            Use first = list.get(0);
            for (Use u : list.subList(1, list.size())) {
                if (!Arrays.equals(first.option().names(), u.option().names())) {
                    problems.add(e.getKey() + ": " + Arrays.toString(first.option().names()) + " in "
                            + first.command() + " but " + Arrays.toString(u.option().names()) + " in " + u.command());
                }
                if (first.option().type() != u.option().type() || first.option().arity().max()
                        != u.option().arity().max()) {
                    problems.add(e.getKey() + ": takes " + first.option().type().getSimpleName() + " in "
                            + first.command() + " but " + u.option().type().getSimpleName() + " in " + u.command());
                }
            }
        }
        if (!problems.isEmpty()) {
            fail(String.join("\n", problems));
        }
    }

    /** An option named for rounding or overflow defaults to one of the kernel's trade names, spelled exactly. */
    @Test
    void roundingAndOverflowOptionsUseTheTradeNames() {
        for (Map.Entry<String, List<Use>> e : uses().entrySet()) {
            String n = e.getKey();
            for (Use u : e.getValue()) {
                String dv = u.option().defaultValue();
                if (dv == null || !n.equals(u.option().longestName())) {
                    continue;
                }
                if (n.endsWith("rounding")) {
                    assertEquals(dv, Rounding.fromName(dv).tradeName(), u.command() + " " + n);
                } else if (n.endsWith("overflow")) {
                    assertEquals(dv, Overflow.fromName(dv).tradeName(), u.command() + " " + n);
                }
            }
        }
        // Nothing on main names a rounding option yet (demap and loss will); the loop engages once one lands.
        // The trade names themselves round-trip, so the loop's oracle is sound.
        for (Rounding r : Rounding.values()) {
            assertEquals(r, Rounding.fromName(r.tradeName()));
        }
        for (Overflow o : Overflow.values()) {
            assertEquals(o, Overflow.fromName(o.tradeName()));
        }
    }

    private static String commandsOf(List<Use> uses) {
        return String.join(", ", uses.stream().map(Use::command).distinct().toList());
    }
}
