package dev.fixmod.verify.vectors;

import dev.fixmod.constellation.Constellation;
import dev.fixmod.constellation.Constellations;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/** Turns a specification's constellation choice into the normalized kernel constellation. */
public final class ConstellationResolver {
    private static final Pattern FAMILY = Pattern.compile("(qam|pam|psk)(\\d{1,4})");

    private ConstellationResolver() {
    }

    /**
     * The normalized constellation of {@code choice}.
     *
     * @throws IllegalArgumentException naming the constellation or labeling and what is accepted
     */
    public static Constellation resolve(VectorSpec.ConstellationChoice choice) {
        Matcher m = FAMILY.matcher(choice.name());
        if (!m.matches()) {
            throw new IllegalArgumentException("unknown constellation '" + choice.name()
                    + "'; expected qamM, pamM or pskM (M a power of two)");
        }
        boolean gray = switch (choice.labeling()) {
            case "gray" -> true;
            case "natural" -> false;
            default -> throw new IllegalArgumentException("unknown labeling '" + choice.labeling()
                    + "' for " + choice.name() + "; expected gray or natural");
        };
        int order = Integer.parseInt(m.group(2));
        Constellation c = switch (m.group(1)) {
            case "qam" -> Constellations.qam(order, gray);
            case "pam" -> Constellations.pam(order, gray);
            default -> Constellations.psk(order, 0.0, gray);
        };
        return c.normalized(choice.normalization());
    }
}
