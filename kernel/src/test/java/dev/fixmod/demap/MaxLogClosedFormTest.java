package dev.fixmod.demap;

import static org.junit.jupiter.api.Assertions.assertEquals;

import dev.fixmod.constellation.Constellation;
import dev.fixmod.constellation.Constellations;
import java.util.function.DoubleUnaryOperator;
import org.junit.jupiter.api.Test;

/**
 * Per-axis max-log against the simplified closed forms for Gray 16- and 64-QAM of F. Tosato and P. Bisaglia,
 * "Simplified soft-output demapper for binary interleaved COFDM with application to HIPERLAN/2", IEEE ICC 2002
 * (expressions recalled from memory). There, on the grid ±1, ±3, … and per axis, the bit metrics D are written so
 * that the LLR is a positive multiple of D for a labeling whose bit is 1 on the positive side and on the inner
 * levels; with fixmod's labels (bit 0 on the negative side and on the outer levels) and L = ln P(0)/P(1), the exact
 * relation is {@code L = −(4/N0)·D}.
 */
class MaxLogClosedFormTest {
    private static final double N0 = 0.7;

    @Test
    void sixteenQamPerAxisMatchesTheSimplifiedExpressions() {
        DoubleUnaryOperator d1 = y -> Math.abs(y) <= 2 ? y : y > 2 ? 2 * (y - 1) : 2 * (y + 1);
        DoubleUnaryOperator d2 = y -> -Math.abs(y) + 2;
        checkBothAxes(Constellations.qam(16, true), new DoubleUnaryOperator[] {d1, d2});
    }

    @Test
    void sixtyFourQamPerAxisMatchesTheSimplifiedExpressions() {
        DoubleUnaryOperator d1 = y -> {
            double a = Math.abs(y);
            double s = Math.signum(y);
            if (a <= 2) {
                return y;
            }
            if (a <= 4) {
                return 2 * (y - s);
            }
            if (a <= 6) {
                return 3 * (y - 2 * s);
            }
            return 4 * (y - 3 * s);
        };
        DoubleUnaryOperator d2 = y -> {
            double a = Math.abs(y);
            if (a <= 2) {
                return 2 * (-a + 3);
            }
            if (a <= 6) {
                return 4 - a;
            }
            return 2 * (-a + 5);
        };
        DoubleUnaryOperator d3 = y -> Math.abs(y) <= 4 ? Math.abs(y) - 2 : -Math.abs(y) + 6;
        checkBothAxes(Constellations.qam(64, true), new DoubleUnaryOperator[] {d1, d2, d3});
    }

    private static void checkBothAxes(Constellation c, DoubleUnaryOperator[] forms) {
        int half = forms.length;
        LlrOptions options = LlrOptions.of(N0);
        SoftDemapper perAxis = new PerAxisMaxLogDemapper(c, options);
        SoftDemapper exhaustive = new MaxLogDemapper(c, options);
        double[] a = new double[2 * half];
        double[] e = new double[2 * half];
        // A grid of samples that includes every segment boundary (even integers) and the points themselves.
        for (int i = -40; i <= 40; i++) {
            double yi = i * 0.25;
            double yq = 1.75 - i * 0.2;
            perAxis.llr(yi, yq, a, 0);
            exhaustive.llr(yi, yq, e, 0);
            for (int j = 0; j < half; j++) {
                double wantI = -4 / N0 * forms[j].applyAsDouble(yi);
                double wantQ = -4 / N0 * forms[j].applyAsDouble(yq);
                double tol = 1e-12 * (1 + Math.abs(wantI) + Math.abs(wantQ));
                assertEquals(wantI, a[j], tol, c.name() + " I bit " + j + " at " + yi);
                assertEquals(wantQ, a[half + j], tol, c.name() + " Q bit " + j + " at " + yq);
                assertEquals(wantI, e[j], 1e-9 * (1 + Math.abs(wantI)), c.name() + " exhaustive I bit " + j);
                assertEquals(wantQ, e[half + j], 1e-9 * (1 + Math.abs(wantQ)), c.name() + " exhaustive Q bit " + j);
            }
        }
    }
}
