package dev.fixmod.verify.constellation;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;

import dev.fixmod.constellation.Catalogue;
import dev.fixmod.constellation.Constellation;
import dev.fixmod.constellation.Normalization;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import net.jqwik.api.constraints.DoubleRange;

/** CSV written by the report reads back to the same constellation, bit for bit. */
class ConstellationFileProperties {

    @Property(tries = 60)
    void csvRoundTripIsExact(@ForAll("names") String name,
                             @ForAll Normalization normalization,
                             @ForAll @DoubleRange(min = 0, max = 0.2) double lambda) {
        Catalogue.Options o = Catalogue.Options.DEFAULT.withNormalization(normalization).withShaping(lambda);
        Constellation c = Catalogue.resolve(name, o);
        String csv = new ConstellationReport(c, normalization, 1, 0, lambda, 0.25).csv();
        Path file;
        try {
            file = Files.createTempFile("roundtrip", ".csv");
            Files.writeString(file, csv, StandardCharsets.UTF_8);
            Constellation back = ConstellationFile.read(file);
            Files.delete(file);
            assertArrayEquals(c.realParts(), back.realParts(), 0.0, name);
            assertArrayEquals(c.imaginaryParts(), back.imaginaryParts(), 0.0, name);
            assertArrayEquals(c.probabilities(), back.probabilities(), 0.0, name);
            assertEquals(c.isSeparable(), back.isSeparable(), "axis layout found again from the points");
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    @Provide
    Arbitrary<String> names() {
        return Arbitraries.of("qam16", "qam256", "psk8", "pam4", "rqam8", "rqam32", "cqam32", "cqam128",
                "apsk16", "apsk32", "star8", "bpsk", "qpsk", "nr:qam64", "wlan:qam1024", "psk32");
    }
}
