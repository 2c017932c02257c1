/*
 * fixmod: set psk8, slicer reference points: row = label, I and Q in demapper input codes
 * (the points every slicer and the LLR datapath compare with; even symbols)
 * psk8_slicer_reference: 8 rows x 2 fields, int16_t each, row-major. A code c of format Qm.n or UQm.n means c * 2^-n.
 *   [0] I: Q1.8 (signed, 10-bit word, 8 fractional bits, range [-2, 1.99609375], LSB 2^-8)
 *   [1] Q: Q1.8 (signed, 10-bit word, 8 fractional bits, range [-2, 1.99609375], LSB 2^-8)
 */
#ifndef FIXMOD_PSK8_SLICER_REFERENCE_H
#define FIXMOD_PSK8_SLICER_REFERENCE_H

#include <stdint.h>

#define PSK8_SLICER_REFERENCE_ROWS 8
#define PSK8_SLICER_REFERENCE_FIELDS 2

static const int16_t psk8_slicer_reference[PSK8_SLICER_REFERENCE_ROWS][PSK8_SLICER_REFERENCE_FIELDS] = {
    {256, 0},
    {181, 181},
    {-181, 181},
    {0, 256},
    {181, -181},
    {0, -256},
    {-256, 0},
    {-181, -181},
};

#endif /* FIXMOD_PSK8_SLICER_REFERENCE_H */
