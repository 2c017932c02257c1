/**
 * Mappers: bits to symbols in floating point, and to fixed-point I/Q codes through a quantized constellation ROM; the
 * constant-gain stage and the datapath cost type shared with the demappers. Depends on the fixed, constellation and
 * bits packages; the demap package and the verify application may use it.
 */
package dev.fixmod.map;
