/**
 * Bits: packing between unpacked bit arrays and MSB-first bytes, and the pseudo-random bit sequences of ITU-T O.150.
 * Depends only on java.base; every other package may use it.
 */
package dev.fixmod.bits;
