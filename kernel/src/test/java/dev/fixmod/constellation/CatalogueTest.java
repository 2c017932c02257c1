package dev.fixmod.constellation;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

/** Name resolution, defaults and the messages for names and options that are not accepted. */
class CatalogueTest {

    private static String error(String name, Catalogue.Options options) {
        return assertThrows(IllegalArgumentException.class, () -> Catalogue.resolve(name, options)).getMessage();
    }

    @Test
    void namesResolveToTheirFamilies() {
        Object[][] table = {
            {"pam4", Family.PAM, 4, "gray"}, {"psk8", Family.PSK, 8, "gray"}, {"qam16", Family.SQUARE_QAM, 16, "gray"},
            {"rqam8", Family.RECTANGULAR_QAM, 8, "gray"}, {"rqam32", Family.RECTANGULAR_QAM, 32, "gray"},
            {"cqam32", Family.CROSS_QAM, 32, "quasi-gray"}, {"apsk16", Family.APSK, 16, "quasi-gray"},
            {"apsk32", Family.APSK, 32, "quasi-gray"}, {"star8", Family.APSK, 8, "quasi-gray"},
            {"pi2bpsk", Family.PI2_BPSK, 2, "gray"}, {"bpsk", Family.PSK, 2, "gray"},
            {"qpsk", Family.SQUARE_QAM, 4, "gray"}, {"nr:qam64", Family.SQUARE_QAM, 64, "nr"},
            {"wlan:qam1024", Family.SQUARE_QAM, 1024, "wlan"}, {"QAM16", Family.SQUARE_QAM, 16, "gray"},
            {"pam1024", Family.PAM, 1024, "gray"}, {"psk1024", Family.PSK, 1024, "gray"},
            {"qam4096", Family.SQUARE_QAM, 4096, "gray"}, {"cqam2048", Family.CROSS_QAM, 2048, "quasi-gray"},
        };
        for (Object[] row : table) {
            Constellation c = Catalogue.resolve((String) row[0]);
            assertEquals(row[1], c.family(), (String) row[0]);
            assertEquals(row[2], c.size(), (String) row[0]);
            assertEquals(row[3], c.labeling(), (String) row[0]);
            assertEquals(1.0, c.averageEnergy(), 1e-12, "unit energy by default: " + row[0]);
        }
        assertEquals("qpsk", Catalogue.resolve("qpsk").name());
        assertEquals("nr:qam64", Catalogue.resolve(" nr:QAM64 ").name());
    }

    @Test
    void optionsApply() {
        Constellation natural = Catalogue.resolve("psk8", Catalogue.Options.DEFAULT.withLabeling(Labeling.NATURAL)
                .withPhaseOffsetDegrees(22.5));
        assertEquals("natural", natural.labeling());
        assertEquals(StrictMath.cos(StrictMath.PI / 8), natural.re(0), 1e-16);
        Constellation peak = Catalogue.resolve("qam16", Catalogue.Options.DEFAULT
                .withNormalization(Normalization.UNIT_PEAK));
        assertEquals(1.0, peak.peakEnergy(), 1e-15);
        Constellation shaped = Catalogue.resolve("qam64", Catalogue.Options.DEFAULT.withShaping(0.05));
        assertEquals(1.0, shaped.averageEnergy(), 1e-12, "normalized under the shaped probabilities");
        assertTrue(shaped.probability(0) < 1.0 / 64, "label 0 is a corner of 64-QAM");
    }

    @Test
    void unknownNamesListWhatIsAccepted() {
        String message = error("nope", Catalogue.Options.DEFAULT);
        assertEquals("unknown constellation 'nope'; accepted: " + Catalogue.acceptedNames(), message);
        for (String pattern : new String[] {"pam<M>", "psk<M>", "qam<M>", "rqam<M>", "rqam<I>x<Q>", "cqam<M>",
            "apsk16", "apsk32", "star8", "bpsk", "qpsk", "pi2bpsk", "nr:<", "wlan:<"}) {
            assertTrue(message.contains(pattern), pattern);
        }
        assertTrue(error("foo:qam16", Catalogue.Options.DEFAULT).startsWith("unknown constellation 'foo:qam16'"));
        assertTrue(error("", Catalogue.Options.DEFAULT).startsWith("unknown constellation ''"));
        assertTrue(error("qam999999", Catalogue.Options.DEFAULT).startsWith("unknown constellation"));
    }

    @Test
    void ordersOutOfRangeSayWhatIsAccepted() {
        assertEquals("qam32: 32 points do not form a square; use rqam32 or cqam32",
                error("qam32", Catalogue.Options.DEFAULT));
        assertEquals("qam8: 8 points do not form a square; use rqam8", error("qam8", Catalogue.Options.DEFAULT));
        assertEquals("PAM order must be a power of two in 2..1024, got 2048", error("pam2048", Catalogue.Options.DEFAULT));
        assertEquals("PSK order must be a power of two in 2..1024, got 6", error("psk6", Catalogue.Options.DEFAULT));
        assertEquals("cross QAM order must be 32, 128, 512 or 2048, got 64", error("cqam64", Catalogue.Options.DEFAULT));
        assertEquals("square QAM order must be a power of two in 4..4096, got 2", error("qam2", Catalogue.Options.DEFAULT));
    }

    @Test
    void optionsThatDoNotApplyAreRejected() {
        assertEquals("qam16 has no quasi-gray labeling; accepted: gray, natural",
                error("qam16", Catalogue.Options.DEFAULT.withLabeling(Labeling.QUASI_GRAY)));
        assertEquals("cqam32 has no gray labeling; accepted: quasi-gray, natural",
                error("cqam32", Catalogue.Options.DEFAULT.withLabeling(Labeling.GRAY)));
        assertEquals("a phase offset applies to psk<M> and bpsk only, not to qam16",
                error("qam16", Catalogue.Options.DEFAULT.withPhaseOffsetDegrees(10)));
        assertThrows(IllegalArgumentException.class, () -> Catalogue.Options.DEFAULT.withShaping(-0.1));
        assertThrows(IllegalArgumentException.class, () -> Catalogue.Options.DEFAULT.withPhaseOffsetDegrees(
                Double.POSITIVE_INFINITY));
    }

    @Test
    void tradeNamesRoundTrip() {
        for (Labeling l : Labeling.values()) {
            assertEquals(l, Labeling.fromName(l.tradeName().toUpperCase(java.util.Locale.ROOT)));
        }
        assertEquals("unknown labeling 'grey'; expected one of gray, natural, quasi-gray",
                assertThrows(IllegalArgumentException.class, () -> Labeling.fromName("grey")).getMessage());
        assertEquals(Normalization.UNIT_BIT_ENERGY, Normalization.fromName("unit_bit_energy"));
    }
}
