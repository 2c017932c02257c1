/*
 * fixmod: set nr-qam256, LLR scale constant K = 1/N0 (4A/N0 for folded-linear) per level, UQ8.8 (unsigned, 16-bit word, 8 fractional bits, range [0, 255.99609375], LSB 2^-8): row 0 for the vectors without noise (the design level),
 * row l + 1 for noise level l (the demapper group's data blocks in level order)
 * nr_qam256_llr_scale: 2 rows x 1 fields, uint16_t each, row-major. A code c of format Qm.n or UQm.n means c * 2^-n.
 *   [0] k: UQ8.8 (unsigned, 16-bit word, 8 fractional bits, range [0, 255.99609375], LSB 2^-8)
 */
#ifndef FIXMOD_NR_QAM256_LLR_SCALE_H
#define FIXMOD_NR_QAM256_LLR_SCALE_H

#include <stdint.h>

#define NR_QAM256_LLR_SCALE_ROWS 2
#define NR_QAM256_LLR_SCALE_FIELDS 1

static const uint16_t nr_qam256_llr_scale[NR_QAM256_LLR_SCALE_ROWS][NR_QAM256_LLR_SCALE_FIELDS] = {
    {64304u},
    {64304u},
};

#endif /* FIXMOD_NR_QAM256_LLR_SCALE_H */
