/*
 * fixmod: set cqam32, slicer reference points: row = label, I and Q in demapper input codes
 * (the points every slicer and the LLR datapath compare with; even symbols)
 * cqam32_slicer_reference: 32 rows x 2 fields, int16_t each, row-major. A code c of format Qm.n or UQm.n means c * 2^-n.
 *   [0] I: Q2.9 (signed, 12-bit word, 9 fractional bits, range [-4, 3.998046875], LSB 2^-9)
 *   [1] Q: Q2.9 (signed, 12-bit word, 9 fractional bits, range [-4, 3.998046875], LSB 2^-9)
 */
#ifndef FIXMOD_CQAM32_SLICER_REFERENCE_H
#define FIXMOD_CQAM32_SLICER_REFERENCE_H

#include <stdint.h>

#define CQAM32_SLICER_REFERENCE_ROWS 32
#define CQAM32_SLICER_REFERENCE_FIELDS 2

static const int16_t cqam32_slicer_reference[CQAM32_SLICER_REFERENCE_ROWS][CQAM32_SLICER_REFERENCE_FIELDS] = {
    {-343, -572},
    {-114, -572},
    {-343, 572},
    {-114, 572},
    {-572, -343},
    {-572, -114},
    {-572, 343},
    {-572, 114},
    {-114, -343},
    {-114, -114},
    {-114, 343},
    {-114, 114},
    {-343, -343},
    {-343, -114},
    {-343, 343},
    {-343, 114},
    {343, -572},
    {114, -572},
    {343, 572},
    {114, 572},
    {572, -343},
    {572, -114},
    {572, 343},
    {572, 114},
    {114, -343},
    {114, -114},
    {114, 343},
    {114, 114},
    {343, -343},
    {343, -114},
    {343, 343},
    {343, 114},
};

#endif /* FIXMOD_CQAM32_SLICER_REFERENCE_H */
