/**
 * The fixed-point number model: Q formats, rounding and overflow modes, and exact operations on raw integer codes.
 * Every fixed-point datapath of the kernel is built from these types; this package depends only on java.base and dev.fixmod.names.
 * Other kernel packages and the verify application may depend on it.
 */
package dev.fixmod.fixed;
