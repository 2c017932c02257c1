/**
 * The hardening suite: malformed specifications, constellation files, vector sets and device dumps fed through the
 * real command line, each required to end in one clear message with exit status 2, without a stack trace, a hang,
 * a partial output or a write outside the run's folder. Test code only; depends on the cli package.
 */
package dev.fixmod.verify.hardening;
