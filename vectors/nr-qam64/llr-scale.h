/*
 * fixmod: set nr-qam64, LLR scale constant K = 1/N0 (4A/N0 for folded-linear) per level, UQ6.10 (unsigned, 16-bit word, 10 fractional bits, range [0, 63.9990234375], LSB 2^-10): row 0 for the vectors without noise (the design level),
 * row l + 1 for noise level l (the demapper group's data blocks in level order)
 * nr_qam64_llr_scale: 3 rows x 1 fields, uint16_t each, row-major. A code c of format Qm.n or UQm.n means c * 2^-n.
 *   [0] k: UQ6.10 (unsigned, 16-bit word, 10 fractional bits, range [0, 63.9990234375], LSB 2^-10)
 */
#ifndef FIXMOD_NR_QAM64_LLR_SCALE_H
#define FIXMOD_NR_QAM64_LLR_SCALE_H

#include <stdint.h>

#define NR_QAM64_LLR_SCALE_ROWS 3
#define NR_QAM64_LLR_SCALE_FIELDS 1

static const uint16_t nr_qam64_llr_scale[NR_QAM64_LLR_SCALE_ROWS][NR_QAM64_LLR_SCALE_FIELDS] = {
    {64610u},
    {16229u},
    {64610u},
};

#endif /* FIXMOD_NR_QAM64_LLR_SCALE_H */
