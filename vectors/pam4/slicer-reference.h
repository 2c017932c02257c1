/*
 * fixmod: set pam4, slicer reference points: row = label, I and Q in demapper input codes
 * (the points every slicer and the LLR datapath compare with; even symbols)
 * pam4_slicer_reference: 4 rows x 2 fields, int16_t each, row-major. A code c of format Qm.n or UQm.n means c * 2^-n.
 *   [0] I: Q3.8 (signed, 12-bit word, 8 fractional bits, range [-8, 7.99609375], LSB 2^-8)
 *   [1] Q: Q3.8 (signed, 12-bit word, 8 fractional bits, range [-8, 7.99609375], LSB 2^-8)
 */
#ifndef FIXMOD_PAM4_SLICER_REFERENCE_H
#define FIXMOD_PAM4_SLICER_REFERENCE_H

#include <stdint.h>

#define PAM4_SLICER_REFERENCE_ROWS 4
#define PAM4_SLICER_REFERENCE_FIELDS 2

static const int16_t pam4_slicer_reference[PAM4_SLICER_REFERENCE_ROWS][PAM4_SLICER_REFERENCE_FIELDS] = {
    {-343, 0},
    {-114, 0},
    {343, 0},
    {114, 0},
};

#endif /* FIXMOD_PAM4_SLICER_REFERENCE_H */
