/**
 * The command line: one picocli command per job, sharing one option vocabulary and one error discipline
 * (a single clear message and exit status 2 for bad input, 1 for mismatches, 0 for success).
 * Depends on every other verify package and on the kernel; nothing depends on it.
 */
package dev.fixmod.verify.cli;
