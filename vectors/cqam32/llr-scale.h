/*
 * fixmod: set cqam32, LLR scale constant K = 1/N0 (4A/N0 for folded-linear) per level, UQ5.11 (unsigned, 16-bit word, 11 fractional bits, range [0, 31.99951171875], LSB 2^-11): row 0 for the vectors without noise (the design level),
 * row l + 1 for noise level l (the demapper group's data blocks in level order)
 * cqam32_llr_scale: 2 rows x 1 fields, uint16_t each, row-major. A code c of format Qm.n or UQm.n means c * 2^-n.
 *   [0] k: UQ5.11 (unsigned, 16-bit word, 11 fractional bits, range [0, 31.99951171875], LSB 2^-11)
 */
#ifndef FIXMOD_CQAM32_LLR_SCALE_H
#define FIXMOD_CQAM32_LLR_SCALE_H

#include <stdint.h>

#define CQAM32_LLR_SCALE_ROWS 2
#define CQAM32_LLR_SCALE_FIELDS 1

static const uint16_t cqam32_llr_scale[CQAM32_LLR_SCALE_ROWS][CQAM32_LLR_SCALE_FIELDS] = {
    {64763u},
    {64763u},
};

#endif /* FIXMOD_CQAM32_LLR_SCALE_H */
