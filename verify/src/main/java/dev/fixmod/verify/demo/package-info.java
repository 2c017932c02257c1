/**
 * {@code fixmod demo}: the built-in fictional scenario run end to end (specifications, golden set, loss report, and a
 * cycle model of the scenario's FPGA demapper compared against the set). May depend on every other verify package
 * and the kernel; nothing depends on it except the CLI.
 */
package dev.fixmod.verify.demo;
