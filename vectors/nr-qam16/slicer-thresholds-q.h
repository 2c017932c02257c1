/*
 * fixmod: set nr-qam16, slicer thresholds on Q, ascending demapper input codes: x >= threshold takes the upper level
 * nr_qam16_slicer_thresholds_q: 3 rows x 1 fields, int16_t each, row-major. A code c of format Qm.n or UQm.n means c * 2^-n.
 *   [0] threshold: Q2.9 (signed, 12-bit word, 9 fractional bits, range [-4, 3.998046875], LSB 2^-9)
 */
#ifndef FIXMOD_NR_QAM16_SLICER_THRESHOLDS_Q_H
#define FIXMOD_NR_QAM16_SLICER_THRESHOLDS_Q_H

#include <stdint.h>

#define NR_QAM16_SLICER_THRESHOLDS_Q_ROWS 3
#define NR_QAM16_SLICER_THRESHOLDS_Q_FIELDS 1

static const int16_t nr_qam16_slicer_thresholds_q[NR_QAM16_SLICER_THRESHOLDS_Q_ROWS][NR_QAM16_SLICER_THRESHOLDS_Q_FIELDS] = {
    {-324},
    {0},
    {324},
};

#endif /* FIXMOD_NR_QAM16_SLICER_THRESHOLDS_Q_H */
