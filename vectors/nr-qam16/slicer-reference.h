/*
 * fixmod: set nr-qam16, slicer reference points: row = label, I and Q in demapper input codes
 * (the points every slicer and the LLR datapath compare with; even symbols)
 * nr_qam16_slicer_reference: 16 rows x 2 fields, int16_t each, row-major. A code c of format Qm.n or UQm.n means c * 2^-n.
 *   [0] I: Q2.9 (signed, 12-bit word, 9 fractional bits, range [-4, 3.998046875], LSB 2^-9)
 *   [1] Q: Q2.9 (signed, 12-bit word, 9 fractional bits, range [-4, 3.998046875], LSB 2^-9)
 */
#ifndef FIXMOD_NR_QAM16_SLICER_REFERENCE_H
#define FIXMOD_NR_QAM16_SLICER_REFERENCE_H

#include <stdint.h>

#define NR_QAM16_SLICER_REFERENCE_ROWS 16
#define NR_QAM16_SLICER_REFERENCE_FIELDS 2

static const int16_t nr_qam16_slicer_reference[NR_QAM16_SLICER_REFERENCE_ROWS][NR_QAM16_SLICER_REFERENCE_FIELDS] = {
    {162, 162},
    {162, 486},
    {486, 162},
    {486, 486},
    {162, -162},
    {162, -486},
    {486, -162},
    {486, -486},
    {-162, 162},
    {-162, 486},
    {-486, 162},
    {-486, 486},
    {-162, -162},
    {-162, -486},
    {-486, -162},
    {-486, -486},
};

#endif /* FIXMOD_NR_QAM16_SLICER_REFERENCE_H */
