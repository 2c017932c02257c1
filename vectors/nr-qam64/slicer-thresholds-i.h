/*
 * fixmod: set nr-qam64, slicer thresholds on I, ascending demapper input codes: x >= threshold takes the upper level
 * nr_qam64_slicer_thresholds_i: 7 rows x 1 fields, int16_t each, row-major. A code c of format Qm.n or UQm.n means c * 2^-n.
 *   [0] threshold: Q2.9 (signed, 12-bit word, 9 fractional bits, range [-4, 3.998046875], LSB 2^-9)
 */
#ifndef FIXMOD_NR_QAM64_SLICER_THRESHOLDS_I_H
#define FIXMOD_NR_QAM64_SLICER_THRESHOLDS_I_H

#include <stdint.h>

#define NR_QAM64_SLICER_THRESHOLDS_I_ROWS 7
#define NR_QAM64_SLICER_THRESHOLDS_I_FIELDS 1

static const int16_t nr_qam64_slicer_thresholds_i[NR_QAM64_SLICER_THRESHOLDS_I_ROWS][NR_QAM64_SLICER_THRESHOLDS_I_FIELDS] = {
    {-474},
    {-316},
    {-158},
    {0},
    {158},
    {316},
    {474},
};

#endif /* FIXMOD_NR_QAM64_SLICER_THRESHOLDS_I_H */
