/**
 * JMH benchmarks of the kernel's hot paths and of the verification tooling (mapper, slicers, LLR demappers, noise,
 * the loss analysis's Monte Carlo chain, vector writers), the report that turns their results into a table and target
 * ratios, and a small cost-growth measurement. May depend on the kernel and on verify's noise, theory, formats and
 * loss packages; nothing depends on it except the CLI's {@code bench} command.
 */
package dev.fixmod.verify.bench;
