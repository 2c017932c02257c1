/**
 * Quantization-loss analysis: the loss specification, the Monte Carlo engine that runs the float reference and the
 * fixed-point model on the same noise, and the reports (Markdown, HTML with SVG charts, JSON, CSV) that size word
 * lengths against a loss budget. Depends on the kernel, {@code verify.noise}, {@code verify.theory} and
 * {@code verify.formats}; only {@code verify.cli} and the benchmarks ({@code verify.bench}) depend on it.
 */
package dev.fixmod.verify.loss;
