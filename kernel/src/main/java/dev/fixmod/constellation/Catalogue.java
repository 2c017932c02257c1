package dev.fixmod.constellation;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * Constellations by name: the names of the command line and of specification files. A name is a family with its
 * order ({@code qam16}, {@code psk8}, {@code rqam8}, {@code rqam8x4}, {@code cqam32}), a fixed member
 * ({@code apsk16}, {@code star8}, {@code bpsk}, {@code pi2bpsk}) or a published mapping {@code <profile>:<member>}
 * ({@code nr:qam64}, {@code wlan:qam1024}). Names are case-insensitive. {@link Options} adds the labeling,
 * normalization, phase offset and Maxwell–Boltzmann shaping.
 *
 * <table class="striped">
 *   <caption>Examples</caption>
 *   <thead><tr><th>name</th><th>constellation</th><th>default labeling</th></tr></thead>
 *   <tbody>
 *     <tr><td>qam16</td><td>square 16-QAM</td><td>gray</td></tr>
 *     <tr><td>rqam8, rqam32</td><td>rectangular 4 × 2, 8 × 4 QAM</td><td>gray</td></tr>
 *     <tr><td>rqam2x8</td><td>rectangular QAM with 2 I and 8 Q levels</td><td>gray</td></tr>
 *     <tr><td>cqam128</td><td>cross 128-QAM</td><td>quasi-gray</td></tr>
 *     <tr><td>apsk32</td><td>4+12+16 APSK</td><td>quasi-gray</td></tr>
 *     <tr><td>qpsk</td><td>same points and labels as qam4</td><td>gray</td></tr>
 *     <tr><td>bpsk</td><td>psk2: label 0 at +1, label 1 at −1</td><td>gray</td></tr>
 *     <tr><td>pi2bpsk</td><td>bpsk, odd-index symbols turned by +90°</td><td>gray</td></tr>
 *     <tr><td>nr:qam16</td><td>3GPP TS 38.211 16-QAM</td><td>fixed: nr</td></tr>
 *     <tr><td>qam32</td><td colspan="2">IllegalArgumentException: 32 is not a square; use rqam32 or cqam32</td></tr>
 *   </tbody>
 * </table>
 *
 * <p>The ring members: {@code apsk16} has rings of 4 and 12 points at radii 1 and 1+√3 with first points at 45° and
 * 15°; {@code apsk32} adds a ring of 16 at radius 1+√3+√2 from 0°; {@code star8} has rings of 4 and 4 at radii 1
 * and (1+√3)/√2 from 45° and 0°. Our choice of radii makes every nearest distance √2: the chords of the first two
 * rings are equal and the third ring is √2 outside the second (in star 8-QAM, each outer point is √2 from its two
 * inner neighbours).
 */
public final class Catalogue {
    private Catalogue() {
    }

    /**
     * How to build a named constellation.
     *
     * @param labeling           the labeling, or {@code null} for the name's default
     * @param normalization      the scale; {@link Normalization#UNIT_ENERGY} by default
     * @param phaseOffsetDegrees the angle of PSK point 0 ({@code psk<M>}, {@code bpsk} only; 0 elsewhere)
     * @param shaping            Maxwell–Boltzmann λ ≥ 0: p(s) ∝ exp(−λ|s|²) on the natural grid, before normalization
     *                           (the normalization depends on the probabilities, so λ cannot refer to the normalized
     *                           points); 0 for equiprobable symbols
     */
    public record Options(Labeling labeling, Normalization normalization, double phaseOffsetDegrees, double shaping) {
        /** Default labeling, unit energy, no phase offset, equiprobable. */
        public static final Options DEFAULT = new Options(null, Normalization.UNIT_ENERGY, 0, 0);

        public Options {
            if (normalization == null) {
                throw new IllegalArgumentException("normalization must be given");
            }
            if (!Double.isFinite(phaseOffsetDegrees)) {
                throw new IllegalArgumentException("phase offset must be a finite number of degrees, got "
                        + phaseOffsetDegrees);
            }
            if (!(shaping >= 0) || !Double.isFinite(shaping)) {
                throw new IllegalArgumentException("Maxwell-Boltzmann parameter must be finite and >= 0, got " + shaping);
            }
        }

        public Options withLabeling(Labeling newLabeling) {
            return new Options(newLabeling, normalization, phaseOffsetDegrees, shaping);
        }

        public Options withNormalization(Normalization newNormalization) {
            return new Options(labeling, newNormalization, phaseOffsetDegrees, shaping);
        }

        public Options withPhaseOffsetDegrees(double degrees) {
            return new Options(labeling, normalization, degrees, shaping);
        }

        public Options withShaping(double lambda) {
            return new Options(labeling, normalization, phaseOffsetDegrees, lambda);
        }
    }

    /**
     * One line of the catalogue's listing.
     *
     * @param pattern     the accepted names, e.g. {@code qam<M>}
     * @param description what they are, with the accepted orders
     * @param labelings   the accepted labelings, the default first (empty for profiles: fixed by the standard)
     */
    public record Entry(String pattern, String description, List<Labeling> labelings) {
        public Entry {
            labelings = List.copyOf(labelings);
        }
    }

    private static final List<Labeling> GRAY_FIRST = List.of(Labeling.GRAY, Labeling.NATURAL);
    private static final List<Labeling> QUASI_GRAY_FIRST = List.of(Labeling.QUASI_GRAY, Labeling.NATURAL);
    private static final Pattern ORDERED = Pattern.compile("(pam|psk|qam|rqam|cqam)([0-9]{1,5})");
    private static final Pattern RECTANGLE = Pattern.compile("rqam([0-9]{1,5})x([0-9]{1,5})");

    /** The families, fixed members and profiles, in the order a listing shows them. */
    public static List<Entry> entries() {
        List<Entry> entries = new ArrayList<>();
        entries.add(new Entry("pam<M>", "M-PAM on the odd integers, M = 2..1024", GRAY_FIRST));
        entries.add(new Entry("psk<M>", "M-PSK on the unit circle, M = 2..1024 (phase offset allowed)", GRAY_FIRST));
        entries.add(new Entry("qam<M>", "square M-QAM on the odd-integer grid, M = 4, 16, 64, 256, 1024, 4096",
                GRAY_FIRST));
        entries.add(new Entry("rqam<M>", "rectangular QAM, I has as many or twice as many levels as Q: rqam8 = 4x2,"
                + " rqam32 = 8x4; M = 4..4096", GRAY_FIRST));
        entries.add(new Entry("rqam<I>x<Q>", "rectangular QAM with I and Q levels given (powers of two >= 2,"
                + " product <= 4096), e.g. rqam16x2", GRAY_FIRST));
        entries.add(new Entry("cqam<M>", "cross QAM, M = 32, 128, 512, 2048", QUASI_GRAY_FIRST));
        entries.add(new Entry("apsk16", "4+12 APSK, radii 1 : 1+sqrt(3)", QUASI_GRAY_FIRST));
        entries.add(new Entry("apsk32", "4+12+16 APSK, radii 1 : 1+sqrt(3) : 1+sqrt(3)+sqrt(2)", QUASI_GRAY_FIRST));
        entries.add(new Entry("star8", "star 8-QAM, 4+4 rings, radii 1 : (1+sqrt(3))/sqrt(2)", QUASI_GRAY_FIRST));
        entries.add(new Entry("bpsk", "psk2: label 0 at +1, label 1 at -1 (phase offset allowed)", GRAY_FIRST));
        entries.add(new Entry("qpsk", "qam4: b0 selects I, b1 selects Q, 0 -> -1", GRAY_FIRST));
        entries.add(new Entry("pi2bpsk", "bpsk with odd-index symbols turned by +90 degrees", GRAY_FIRST));
        for (Profile p : Profile.values()) {
            entries.add(new Entry(p.prefix() + ":<" + String.join("|", p.members()) + ">", p.source()
                    + " (labeling fixed by the standard)", List.of()));
        }
        return entries;
    }

    /** The accepted names in one line, for error messages. */
    public static String acceptedNames() {
        StringBuilder sb = new StringBuilder();
        for (Entry e : entries()) {
            if (sb.length() > 0) {
                sb.append(", ");
            }
            sb.append(e.pattern());
        }
        return sb.toString();
    }

    /** The named constellation with {@link Options#DEFAULT}. */
    public static Constellation resolve(String name) {
        return resolve(name, Options.DEFAULT);
    }

    /**
     * The named constellation: built on its natural grid with the chosen labeling, shaped, then normalized.
     *
     * @throws IllegalArgumentException for an unknown name, an order out of range, or an option that does not apply,
     *                                  with a message saying what is accepted
     */
    public static Constellation resolve(String name, Options options) {
        return shape(resolveOnGrid(name, options), options).normalized(options.normalization());
    }

    /**
     * The named constellation on its natural grid with the labeling and phase offset of {@code options}, before
     * shaping and normalization: {@code resolve(name, o)} is {@code shape(resolveOnGrid(name, o), o)
     * .normalized(o.normalization())}.
     */
    public static Constellation resolveOnGrid(String name, Options options) {
        return onGrid(name == null ? "" : name.trim().toLowerCase(Locale.ROOT), options);
    }

    /**
     * Applies the Maxwell–Boltzmann shaping of {@code options} to a constellation on its natural grid (also one read
     * from a user's file); λ &gt; 0 replaces any probabilities it had, λ = 0 keeps them.
     */
    public static Constellation shape(Constellation grid, Options options) {
        return options.shaping() > 0 ? grid.withMaxwellBoltzmann(options.shaping()) : grid;
    }

    private static Constellation onGrid(String key, Options options) {
        int colon = key.indexOf(':');
        if (colon >= 0) {
            Profile profile = Profile.ofPrefix(key.substring(0, colon));
            if (profile == null) {
                throw unknown(key);
            }
            if (options.labeling() != null) {
                throw new IllegalArgumentException(key + " has the labeling fixed by " + profile.source()
                        + "; give no labeling");
            }
            requireNoPhaseOffset(key, options);
            return profile.onGrid(key.substring(colon + 1));
        }
        switch (key) {
            case "bpsk":
                return Constellations.pskDegrees(2, options.phaseOffsetDegrees(), labeling(key, options, GRAY_FIRST))
                        .withName(key);
            case "qpsk":
                requireNoPhaseOffset(key, options);
                return Constellations.qam(4, labeling(key, options, GRAY_FIRST)).withName(key);
            case "pi2bpsk":
                requireNoPhaseOffset(key, options);
                return Constellations.pskDegrees(2, 0, labeling(key, options, GRAY_FIRST))
                        .withAlternatingQuarterTurn(key);
            case "apsk16":
                requireNoPhaseOffset(key, options);
                return Constellations.apsk(key, new int[] {4, 12}, new double[] {1, 1 + StrictMath.sqrt(3)},
                        new double[] {45, 15}, labeling(key, options, QUASI_GRAY_FIRST));
            case "apsk32":
                requireNoPhaseOffset(key, options);
                return Constellations.apsk(key, new int[] {4, 12, 16},
                        new double[] {1, 1 + StrictMath.sqrt(3), 1 + StrictMath.sqrt(3) + StrictMath.sqrt(2)},
                        new double[] {45, 15, 0}, labeling(key, options, QUASI_GRAY_FIRST));
            case "star8":
                requireNoPhaseOffset(key, options);
                return Constellations.apsk(key, new int[] {4, 4},
                        new double[] {1, (1 + StrictMath.sqrt(3)) / StrictMath.sqrt(2)}, new double[] {45, 0},
                        labeling(key, options, QUASI_GRAY_FIRST));
            default:
                return ordered(key, options);
        }
    }

    private static Constellation ordered(String key, Options options) {
        Matcher rectangle = RECTANGLE.matcher(key);
        if (rectangle.matches()) {
            requireNoPhaseOffset(key, options);
            return Constellations.rectangularQam(Integer.parseInt(rectangle.group(1)),
                    Integer.parseInt(rectangle.group(2)), labeling(key, options, GRAY_FIRST));
        }
        Matcher ordered = ORDERED.matcher(key);
        if (!ordered.matches()) {
            throw unknown(key);
        }
        String family = ordered.group(1);
        int m = Integer.parseInt(ordered.group(2));
        if (!family.equals("psk")) {
            requireNoPhaseOffset(key, options);
        }
        switch (family) {
            case "pam":
                return Constellations.pam(m, labeling(key, options, GRAY_FIRST));
            case "psk":
                return Constellations.pskDegrees(m, options.phaseOffsetDegrees(), labeling(key, options, GRAY_FIRST));
            case "qam":
                if (m >= 8 && m <= 4096 && Integer.bitCount(m) == 1 && Integer.numberOfTrailingZeros(m) % 2 != 0) {
                    throw new IllegalArgumentException(key + ": " + m + " points do not form a square; use rqam" + m
                            + (m >= 32 && m <= 2048 ? " or cqam" + m : ""));
                }
                return Constellations.qam(m, labeling(key, options, GRAY_FIRST));
            case "rqam":
                if (m < 4 || m > 4096 || Integer.bitCount(m) != 1) {
                    throw new IllegalArgumentException("rectangular QAM order must be a power of two in 4..4096, got "
                            + m);
                }
                int k = Integer.numberOfTrailingZeros(m);
                return Constellations.rectangularQam(1 << ((k + 1) / 2), 1 << (k / 2),
                        labeling(key, options, GRAY_FIRST));
            default:
                return Constellations.crossQam(m, labeling(key, options, QUASI_GRAY_FIRST));
        }
    }

    private static Labeling labeling(String key, Options options, List<Labeling> accepted) {
        Labeling chosen = options.labeling() == null ? accepted.get(0) : options.labeling();
        if (!accepted.contains(chosen)) {
            throw new IllegalArgumentException(key + " has no " + chosen + " labeling; accepted: "
                    + String.join(", ", accepted.stream().map(Labeling::tradeName).toArray(String[]::new)));
        }
        return chosen;
    }

    private static void requireNoPhaseOffset(String key, Options options) {
        if (options.phaseOffsetDegrees() != 0) {
            throw new IllegalArgumentException("a phase offset applies to psk<M> and bpsk only, not to " + key);
        }
    }

    private static IllegalArgumentException unknown(String key) {
        return new IllegalArgumentException("unknown constellation '" + key + "'; accepted: " + acceptedNames());
    }
}
