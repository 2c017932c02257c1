/*
 * fixmod: set pam4, slicer thresholds on I, ascending demapper input codes: x >= threshold takes the upper level
 * pam4_slicer_thresholds_i: 3 rows x 1 fields, int16_t each, row-major. A code c of format Qm.n or UQm.n means c * 2^-n.
 *   [0] threshold: Q3.8 (signed, 12-bit word, 8 fractional bits, range [-8, 7.99609375], LSB 2^-8)
 */
#ifndef FIXMOD_PAM4_SLICER_THRESHOLDS_I_H
#define FIXMOD_PAM4_SLICER_THRESHOLDS_I_H

#include <stdint.h>

#define PAM4_SLICER_THRESHOLDS_I_ROWS 3
#define PAM4_SLICER_THRESHOLDS_I_FIELDS 1

static const int16_t pam4_slicer_thresholds_i[PAM4_SLICER_THRESHOLDS_I_ROWS][PAM4_SLICER_THRESHOLDS_I_FIELDS] = {
    {-228},
    {0},
    {229},
};

#endif /* FIXMOD_PAM4_SLICER_THRESHOLDS_I_H */
