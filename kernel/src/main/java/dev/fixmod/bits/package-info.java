/**
 * Bits: unpacked bit arrays, packing to MSB-first bytes and to symbol labels, and bit sources (the pseudo-random
 * sequences of ITU-T O.150, constant and repeating patterns) behind one {@link dev.fixmod.bits.BitSource} interface.
 * Depends only on java.base; every other package may use it.
 */
package dev.fixmod.bits;
