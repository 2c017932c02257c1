/**
 * Trade names: the one spelling of each closed-set choice (rounding, overflow, labeling, algorithm...) that the API,
 * the command line, the specification files and the reports share, and their lookup with one error message.
 * Depends only on java.base; every other package may use it.
 */
package dev.fixmod.names;
