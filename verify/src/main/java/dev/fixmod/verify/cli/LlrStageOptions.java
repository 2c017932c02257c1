package dev.fixmod.verify.cli;

import dev.fixmod.demap.FixedLlrSpec;
import dev.fixmod.demap.LlrScaling;
import dev.fixmod.fixed.QFormat;
import dev.fixmod.fixed.Quantizer;
import dev.fixmod.fixed.Rounding;
import picocli.CommandLine.Option;

/**
 * The stages of the fixed LLR datapath as options of {@code fixmod demap} (a picocli mixin): each stage the user
 * gives replaces the suggested one, and a bad stage is reported with its option's name. Whether the stages fit
 * together is left to {@link FixedLlrSpec}'s own validation.
 */
final class LlrStageOptions {

    @Option(names = "--llr", paramLabel = "STAGE", defaultValue = "Q4.1,half-even,symmetric-saturate",
            description = "Fixed LLR output stage, as the specs' \"llr\" key (default: ${DEFAULT-VALUE}).")
    String output;

    @Option(names = "--metric", paramLabel = "STAGE", description = "Metric stage, e.g. Q6.12,half-even,saturate.")
    String metric;

    @Option(names = "--scale-constant", paramLabel = "QFORMAT",
            description = "Format of the scale constant K (1/N0 or 4A/N0), e.g. UQ4.12.")
    String scaleConstant;

    @Option(names = "--scale", paramLabel = "STAGE", description = "Product stage metric x K, e.g. Q7.5,floor,saturate.")
    String scale;

    @Option(names = "--scaling", paramLabel = "MODE", defaultValue = "noise-scaled",
            description = "noise-scaled (output in nats) or unscaled (output = metric) (default: ${DEFAULT-VALUE}).")
    String scaling;

    @Option(names = "--constant-rounding", paramLabel = "ROUNDING", defaultValue = "half-even",
            description = "How K and the fold constants are quantized (default: ${DEFAULT-VALUE}).")
    String constantRounding;

    /** The output stage ({@code --llr} always has a value: its default). */
    Quantizer output() {
        return stage("--llr", output, null);
    }

    /** The user's stages over {@code suggested}, in the order they are checked: constants, metric, scaling, K, scale. */
    FixedLlrSpec over(FixedLlrSpec suggested) {
        Rounding constants = Rounding.fromName(constantRounding);
        Quantizer m = stage("--metric", metric, suggested.metric());
        if (LlrScaling.fromName(scaling) == LlrScaling.UNSCALED) {
            if (scaleConstant != null || scale != null) {
                throw new UsageException("--scale-constant and --scale apply to --scaling noise-scaled only");
            }
            return FixedLlrSpec.unscaled(constants, m, output());
        }
        QFormat k = scaleConstant == null ? suggested.scaleConstant() : QFormat.parse(scaleConstant);
        Quantizer s = stage("--scale", scale, suggested.scale());
        return new FixedLlrSpec(constants, m, LlrScaling.NOISE_SCALED, k, s, output());
    }

    /** The stage written in {@code text} (format, rounding, overflow), or {@code suggested} if the option is absent. */
    private static Quantizer stage(String option, String text, Quantizer suggested) {
        if (text == null) {
            return suggested;
        }
        try {
            return Quantizer.parse(text.replace(',', ' '));
        } catch (IllegalArgumentException e) {
            throw new UsageException(option + ": " + e.getMessage());
        }
    }
}
