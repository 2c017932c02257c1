/**
 * Slicers and hard and soft (LLR) demappers in floating point and bit-exact fixed point, with energy normalization.
 * Depends on the fixed, constellation, map and bits packages; only the verify application depends on it.
 */
package dev.fixmod.demap;
