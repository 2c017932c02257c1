/**
 * Mappers: bits to symbols in floating point, and to fixed-point I/Q codes through a quantized constellation ROM.
 * Depends on the fixed, constellation and bits packages; the demap package and the verify application may use it.
 */
package dev.fixmod.map;
