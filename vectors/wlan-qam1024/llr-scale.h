/*
 * fixmod: set wlan-qam1024, LLR scale constant K = 1/N0 (4A/N0 for folded-linear) per level, UQ11.5 (unsigned, 16-bit word, 5 fractional bits, range [0, 2047.96875], LSB 2^-5): row 0 for the vectors without noise (the design level),
 * row l + 1 for noise level l (the demapper group's data blocks in level order)
 * wlan_qam1024_llr_scale: 2 rows x 1 fields, uint16_t each, row-major. A code c of format Qm.n or UQm.n means c * 2^-n.
 *   [0] k: UQ11.5 (unsigned, 16-bit word, 5 fractional bits, range [0, 2047.96875], LSB 2^-5)
 */
#ifndef FIXMOD_WLAN_QAM1024_LLR_SCALE_H
#define FIXMOD_WLAN_QAM1024_LLR_SCALE_H

#include <stdint.h>

#define WLAN_QAM1024_LLR_SCALE_ROWS 2
#define WLAN_QAM1024_LLR_SCALE_FIELDS 1

static const uint16_t wlan_qam1024_llr_scale[WLAN_QAM1024_LLR_SCALE_ROWS][WLAN_QAM1024_LLR_SCALE_FIELDS] = {
    {32000u},
    {42264u},
};

#endif /* FIXMOD_WLAN_QAM1024_LLR_SCALE_H */
