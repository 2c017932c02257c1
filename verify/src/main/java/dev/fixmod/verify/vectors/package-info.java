/**
 * Golden vector sets: the versioned specification, corner-case flags, the streamed generator of stimulus and
 * expected outputs per port, the manifest and the checker that regenerates a set byte for byte.
 * Depends on the kernel and on verify's noise and formats packages; the command line depends on it, and compare
 * reads sets through its {@link dev.fixmod.verify.vectors.Manifest}.
 */
package dev.fixmod.verify.vectors;
