/**
 * JMH benchmarks of the kernel's hot paths and of the verification tooling (mapper, slicers, LLR demappers, noise,
 * a composed Monte Carlo chain, vector writers), the report that turns their results into a table and target ratios,
 * and a small cost-growth measurement. May depend on the kernel and on verify's noise, theory and formats packages;
 * nothing depends on it except the CLI's {@code bench} command.
 */
package dev.fixmod.verify.bench;
