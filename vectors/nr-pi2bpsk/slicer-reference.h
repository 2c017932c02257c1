/*
 * fixmod: set nr-pi2bpsk, slicer reference points: row = label, I and Q in demapper input codes
 * (the points every slicer and the LLR datapath compare with; even symbols)
 * nr_pi2bpsk_slicer_reference: 2 rows x 2 fields, int16_t each, row-major. A code c of format Qm.n or UQm.n means c * 2^-n.
 *   [0] I: Q2.9 (signed, 12-bit word, 9 fractional bits, range [-4, 3.998046875], LSB 2^-9)
 *   [1] Q: Q2.9 (signed, 12-bit word, 9 fractional bits, range [-4, 3.998046875], LSB 2^-9)
 */
#ifndef FIXMOD_NR_PI2BPSK_SLICER_REFERENCE_H
#define FIXMOD_NR_PI2BPSK_SLICER_REFERENCE_H

#include <stdint.h>

#define NR_PI2BPSK_SLICER_REFERENCE_ROWS 2
#define NR_PI2BPSK_SLICER_REFERENCE_FIELDS 2

static const int16_t nr_pi2bpsk_slicer_reference[NR_PI2BPSK_SLICER_REFERENCE_ROWS][NR_PI2BPSK_SLICER_REFERENCE_FIELDS] = {
    {362, 362},
    {-362, -362},
};

#endif /* FIXMOD_NR_PI2BPSK_SLICER_REFERENCE_H */
