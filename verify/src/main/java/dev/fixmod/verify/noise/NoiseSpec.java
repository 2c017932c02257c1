package dev.fixmod.verify.noise;

import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;

/** The identity of the noise algorithm and its published description, for manifests and format documentation. */
public final class NoiseSpec {

    /**
     * The identifier a manifest records: it covers the Philox layout, the uniform conversions, both Gaussian
     * methods and AWGN scaling. Anything that changes a single output bit gets a new identifier.
     */
    public static final String VERSION = "fixmod-noise-1";

    /** The classpath resource holding the exact description a testbench reimplements. */
    public static final String DOCUMENT = "/noise-algorithm.md";

    private NoiseSpec() {
    }

    /** The text of {@link #DOCUMENT} (Markdown, UTF-8). */
    public static String document() {
        try (InputStream in = NoiseSpec.class.getResourceAsStream(DOCUMENT)) {
            if (in == null) {
                throw new IllegalStateException("resource " + DOCUMENT + " is missing from the application jar");
            }
            return new String(in.readAllBytes(), StandardCharsets.UTF_8);
        } catch (IOException e) {
            throw new UncheckedIOException("cannot read " + DOCUMENT, e);
        }
    }
}
