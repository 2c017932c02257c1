/*
 * fixmod: set nr-qam16, LLR scale constant K = 1/N0 (4A/N0 for folded-linear) per level, UQ4.12 (unsigned, 16-bit word, 12 fractional bits, range [0, 15.999755859375], LSB 2^-12): row 0 for the vectors without noise (the design level),
 * row l + 1 for noise level l (the demapper group's data blocks in level order)
 * nr_qam16_llr_scale: 3 rows x 1 fields, uint16_t each, row-major. A code c of format Qm.n or UQm.n means c * 2^-n.
 *   [0] k: UQ4.12 (unsigned, 16-bit word, 12 fractional bits, range [0, 15.999755859375], LSB 2^-12)
 */
#ifndef FIXMOD_NR_QAM16_LLR_SCALE_H
#define FIXMOD_NR_QAM16_LLR_SCALE_H

#include <stdint.h>

#define NR_QAM16_LLR_SCALE_ROWS 3
#define NR_QAM16_LLR_SCALE_FIELDS 1

static const uint16_t nr_qam16_llr_scale[NR_QAM16_LLR_SCALE_ROWS][NR_QAM16_LLR_SCALE_FIELDS] = {
    {64917u},
    {16306u},
    {64917u},
};

#endif /* FIXMOD_NR_QAM16_LLR_SCALE_H */
