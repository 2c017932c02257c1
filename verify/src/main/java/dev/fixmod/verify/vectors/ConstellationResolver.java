package dev.fixmod.verify.vectors;

import dev.fixmod.constellation.Catalogue;
import dev.fixmod.constellation.Constellation;
import dev.fixmod.constellation.Labeling;

/** Turns a specification's constellation choice into the normalized kernel constellation, via the catalogue. */
public final class ConstellationResolver {
    /** The labeling value that means "the name's own default" (Gray for families, the standard's for profiles). */
    public static final String DEFAULT_LABELING = "default";

    private ConstellationResolver() {
    }

    /**
     * The normalized constellation of {@code choice}.
     *
     * @throws IllegalArgumentException naming the constellation or labeling and what is accepted
     */
    public static Constellation resolve(VectorSpec.ConstellationChoice choice) {
        Labeling labeling = choice.labeling().equals(DEFAULT_LABELING) ? null : Labeling.fromName(choice.labeling());
        Catalogue.Options options = new Catalogue.Options(labeling, choice.normalization(),
                choice.phaseOffsetDegrees(), 0);
        return Catalogue.resolve(choice.name(), options);
    }
}
