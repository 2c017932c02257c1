package dev.fixmod.verify.vectors;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.fixmod.constellation.Normalization;
import dev.fixmod.demap.LlrScaling;
import dev.fixmod.demap.LlrSign;
import dev.fixmod.demap.SoftAlgorithm;
import dev.fixmod.fixed.Overflow;
import dev.fixmod.fixed.QFormat;
import dev.fixmod.fixed.Rounding;
import dev.fixmod.verify.formats.FileFormat;
import java.util.EnumSet;
import java.util.List;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.api.Test;

class SpecReaderTest {

    @Test
    void aShortSpecGetsEveryDefault() {
        VectorSpec s = SpecReader.parse("{\n  \"constellation\": \"qam64\"\n}\n", "s.json");
        assertEquals("qam64", s.name());
        assertEquals("default", s.constellation().labeling());
        assertEquals(Normalization.UNIT_ENERGY, s.constellation().normalization());
        assertEquals(QFormat.parse("Q1.14"), s.mapper().format());
        assertEquals(QFormat.parse("Q2.9"), s.demapper().input().format());
        assertEquals(QFormat.parse("Q5.0"), s.demapper().llr().format());
        assertEquals(Overflow.SYMMETRIC_SATURATE, s.demapper().llr().overflow());
        assertEquals(Rounding.HALF_EVEN, s.demapper().input().rounding());
        assertEquals(LlrSign.ZERO_POSITIVE, s.demapper().llrSign());
        assertEquals(SoftAlgorithm.MAX_LOG, s.demapper().algorithm());
        assertEquals(SoftAlgorithm.MAX_LOG, s.demapper().reference());
        assertEquals(LlrScaling.NOISE_SCALED, s.demapper().scaling());
        assertEquals("prbs-23", s.bits().source());
        assertEquals((1L << 23) - 1, s.bits().seed());
        assertEquals(List.of(10.0, 20.0), s.noise().levelsDb());
        assertEquals(256, s.count());
        assertEquals(EnumSet.allOf(CornerGroup.class), s.cornerCases());
        assertEquals(EnumSet.of(FileFormat.HEX, FileFormat.CSV, FileFormat.BINARY, FileFormat.C_HEADER, FileFormat.NPY),
                s.formats());
    }

    @Test
    void theEmptyObjectIsAValidSpec() {
        assertEquals("qam16", SpecReader.parse("{}", "s.json").constellation().name());
    }

    @Test
    void canonicalFormReadsBackToTheSameSpecAndIsAFixedPoint() {
        VectorSpec s = SpecReader.parse("{\"formats\":[\"npy\",\"hex\"],\"count\":7,\"constellation\":{\"name\":"
                + "\"psk8\",\"labeling\":\"natural\"},\"noise\":{\"eb-n0-db\":[3.5],\"code-rate\":0.5,\"seed\":9},"
                + "\"bits\":{\"source\":\"prbs-9\",\"seed\":5},\"corner-cases\":[\"zero\",\"labels\"]}", "s.json");
        String canonical = s.toCanonicalJson().toString();
        VectorSpec again = SpecReader.parse(canonical, "manifest");
        assertEquals(s, again);
        assertEquals(canonical, again.toCanonicalJson().toString());
        // key order is fixed, whatever order the file used
        assertTrue(canonical.startsWith("{\"schema\":\"fixmod-vector-spec\",\"version\":1,\"name\":\"psk8\","
                + "\"constellation\":"), canonical);
        assertTrue(canonical.contains("\"corner-cases\":[\"labels\",\"zero\"],\"formats\":[\"hex\",\"npy\"]"),
                canonical);
    }

    /** Each malformed spec: the message names the place (line:column and JSON path) and what is accepted. */
    @ParameterizedTest
    @CsvSource(delimiter = '|', textBlock = """
            {"constelation": "qam16"}                                   | s.json:1:2: constelation: unknown key "constelation"; expected one of schema
            {"mapper": {"format": "Q1,14"}}                             | s.json:1:13: mapper.format: 'Q1,14' is not a Q format
            {"mapper": {"format": "UQ1.14"}}                            | mapper.format: 'UQ1.14' is unsigned
            {"mapper": {"format": "Q20.20"}}                            | mapper.format: 'Q20.20': word length 41
            {"demapper": {"llr": {"rounding": "round"}}}                | s.json:1:23: demapper.llr.rounding: unknown rounding 'round'; expected one of floor, ceil, toward-zero, half-up, half-away, half-even
            {"demapper": {"input": {"overflow": "clip"}}}               | demapper.input.overflow: unknown overflow 'clip'; expected one of saturate, symmetric-saturate, wrap
            {"count": -5}                                               | s.json:1:2: count: -5 is out of range; expected an integer from 0 to 1000000000
            {"count": 2.5}                                              | count: expected an integer from 0 to 1000000000, got the number 2.5
            {"count": "100"}                                            | count: expected an integer from 0 to 1000000000, got the string "100"
            {"count": 1, "count": 2}                                    | s.json:1:21: not valid JSON: Duplicate field 'count'
            {"noise": {"es-n0-db": [1, NaN]}}                           | s.json:1:31: not valid JSON: Non-standard token 'NaN'; numbers must be finite decimals
            {"noise": {"es-n0-db": [1, "NaN"]}}                         | s.json:1:28: noise.es-n0-db[1]: expected a number, got the string "NaN"
            {"noise": {"es-n0-db": [1e999]}}                            | s.json:1:25: noise.es-n0-db[0]: Infinity is not a finite number
            {"noise": {"es-n0-db": 10}}                                 | noise.es-n0-db: expected an array of numbers in dB
            {"noise": {"es-n0-db": [1], "eb-n0-db": [2]}}               | noise.eb-n0-db: give either es-n0-db or eb-n0-db, not both
            {"noise": {"code-rate": 0}}                                 | noise.code-rate: 0.0 is not a code rate; expected a number in (0, 1]
            {"bits": {"source": "prbs-8"}}                              | bits.source: unknown bit source 'prbs-8'; expected one of prbs-7, prbs-9
            {"bits": {"source": "prbs-7", "seed": 0}}                   | bits.seed: 0 is out of range; expected an integer from 1 to 127
            {"bits": {"source": "prbs-7", "value": 1}}                  | bits.value: unknown key "value"; expected one of source, seed
            {"bits": {"source": "constant", "value": 2}}                | bits.value: 2 is out of range; expected an integer from 0 to 1
            {"bits": {"source": "file"}}                                | bits: source "file" needs the key "file"
            {"bits": true}                                              | bits: expected a JSON object {...}, got the boolean true
            {"formats": ["hex", "vcd"]}                                 | s.json:1:21: formats[1]: unknown format 'vcd'; expected one of hex, hex-commented, csv, binary, packed-binary, c-header, npy
            {"formats": "hex"}                                          | formats: expected an array of names from hex, hex-commented, csv, binary, packed-binary, c-header, npy, got the string "hex"
            {"corner-cases": ["zero", "zero"]}                          | corner-cases[1]: 'zero' is listed twice
            {"corner-cases": [null]}                                    | corner-cases[0]: expected a name from labels, thresholds, ties, extremes, zero, llr-limits, got null
            {"demapper": {"algorithm": "log-map"}}                      | demapper.algorithm: log-map has no fixed-point datapath; expected max-log, max-log-per-axis or folded-linear
            {"demapper": {"reference": "exact"}}                        | demapper.reference: unknown soft demapping algorithm 'exact'; expected one of log-map, max-log
            {"demapper": {"scaling": "unscaled", "scale": {}}}          | demapper.scale: an unscaled datapath has no scale
            {"demapper": {"scaling": "linear"}}                         | demapper.scaling: unknown LLR scaling 'linear'; expected one of noise-scaled, unscaled
            {"demapper": {"input": {"format": "Q20.10"}}}               | s.json:1:2: demapper: the metric of qam16 from input Q20.10 needs 42 integer bits, more than a 32-bit word holds
            {"constellation": "psk8", "demapper": {"algorithm": "max-log-per-axis"}} | demapper: max-log-per-axis needs a separable constellation
            {"noise": {"seed": 4294967296}}                             | noise.seed: 4294967296 is out of range; expected an integer from 0 to 4294967295
            {"noise": {"gaussian": "polar"}}                            | noise.gaussian: unknown Gaussian sampler 'polar'; expected one of box-muller, ziggurat
            {"demapper": {"llr-sign": "negative"}}                      | s.json:1:15: demapper.llr-sign: unknown LLR sign 'negative'; expected one of zero-positive, one-positive
            {"constellation": {"name": "qam17"}}                        | s.json:1:20: constellation.name:
            {"constellation": "nr:qam17"}                               | s.json:1:2: constellation:
            {"constellation": 16}                                       | s.json:1:2: constellation: expected a constellation name such as "nr:qam16" or an object {"name": ...}, got the number 16
            {"constellation": "pi2bpsk", "demapper": {"algorithm": "max-log-per-axis"}} | demapper.algorithm: max-log-per-axis needs a separable constellation, and pi2bpsk is not: it turns odd-index symbols by +90°
            {"constellation": {"name": "qam16", "labeling": "spiral"}}  | constellation.labeling: unknown labeling 'spiral'
            {"constellation": {"normalization": "unit"}}                | constellation.normalization: unknown normalization 'unit'; expected one of none, unit-energy
            {"constellation": {"name": "nr:qam16", "labeling": "gray"}} | constellation.labeling:
            {"schema": "other"}                                         | schema: 'other' is not this tool's schema
            {"version": 2}                                              | version: version 2 is not supported
            {"name": "a b"}                                             | name: 'a b' is not a set name
            {"constellation": "wlan:qam1024", "demapper": {"llr": {"format": "Q6.0"}}} | demapper.llr.format: 10 LLRs of 7 bits make a 70-bit word; the LLR port holds at most 64 bits, so use at most 6-bit LLRs
            [1, 2]                                                      | s.json:1:1: (top level): expected a JSON object {...}, got an array
            {"count": 1} x                                              | s.json:1:15: not valid JSON: Unrecognized token 'x'
            {"count": 1                                                 | not valid JSON: Unexpected end-of-input
            """)
    void malformedSpecsAreRejectedWithPlaceAndAlternatives(String spec, String expected) {
        SpecException e = assertThrows(SpecException.class, () -> SpecReader.parse(spec, "s.json"));
        assertTrue(e.getMessage().contains(expected), () -> "message was: " + e.getMessage());
    }

    @Test
    void emptyTextIsRejected() {
        SpecException e = assertThrows(SpecException.class, () -> SpecReader.parse("  \n", "s.json"));
        assertTrue(e.getMessage().startsWith("s.json: empty specification"), e.getMessage());
    }

    @Test
    void linesAndColumnsPointAtTheKeyInMultiLineFiles() {
        String spec = "{\n  \"demapper\": {\n    \"llr\": {\n      \"format\": \"Q5.x\"\n    }\n  }\n}\n";
        SpecException e = assertThrows(SpecException.class, () -> SpecReader.parse(spec, "nr.json"));
        assertTrue(e.getMessage().startsWith("nr.json:4:7: demapper.llr.format: 'Q5.x' is not a Q format"),
                e.getMessage());
    }
}
