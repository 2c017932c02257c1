/*
 * fixmod: set nr-pi2bpsk, LLR scale constant K = 1/N0 (4A/N0 for folded-linear) per level, UQ2.14 (unsigned, 16-bit word, 14 fractional bits, range [0, 3.99993896484375], LSB 2^-14): row 0 for the vectors without noise (the design level),
 * row l + 1 for noise level l (the demapper group's data blocks in level order)
 * nr_pi2bpsk_llr_scale: 3 rows x 1 fields, uint16_t each, row-major. A code c of format Qm.n or UQm.n means c * 2^-n.
 *   [0] k: UQ2.14 (unsigned, 16-bit word, 14 fractional bits, range [0, 3.99993896484375], LSB 2^-14)
 */
#ifndef FIXMOD_NR_PI2BPSK_LLR_SCALE_H
#define FIXMOD_NR_PI2BPSK_LLR_SCALE_H

#include <stdint.h>

#define NR_PI2BPSK_LLR_SCALE_ROWS 3
#define NR_PI2BPSK_LLR_SCALE_FIELDS 1

static const uint16_t nr_pi2bpsk_llr_scale[NR_PI2BPSK_LLR_SCALE_ROWS][NR_PI2BPSK_LLR_SCALE_FIELDS] = {
    {65226u},
    {16384u},
    {65226u},
};

#endif /* FIXMOD_NR_PI2BPSK_LLR_SCALE_H */
