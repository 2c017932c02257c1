/**
 * Constellations: families, labelings, the mappings of published standards, normalization and the ideal metrics
 * (energies, d_min, power and bandwidth efficiency) that every quantization loss is measured against.
 * Depends only on java.base and dev.fixmod.names; the map and demap packages and the verify application depend on it.
 */
package dev.fixmod.constellation;
