/*
 * fixmod: set nr-pi2bpsk, PSK sector slicer lines: row j = the line through the boundary rays at phi0 + (2j+1)*180/M
 * and phi0 + (2j+1)*180/M + 180 degrees (phi0 = angle of label 0), normal (a, b) toward +I
 * (+Q if a = 0): a*I + b*Q >= 0 means on the line or on its larger-I side; the decision is the
 * reference point whose M/2 test results equal the sample's (even symbols)
 * nr_pi2bpsk_slicer_lines: 1 rows x 2 fields, int16_t each, row-major. A code c of format Qm.n or UQm.n means c * 2^-n.
 *   [0] a: Q1.14 (signed, 16-bit word, 14 fractional bits, range [-2, 1.99993896484375], LSB 2^-14)
 *   [1] b: Q1.14 (signed, 16-bit word, 14 fractional bits, range [-2, 1.99993896484375], LSB 2^-14)
 */
#ifndef FIXMOD_NR_PI2BPSK_SLICER_LINES_H
#define FIXMOD_NR_PI2BPSK_SLICER_LINES_H

#include <stdint.h>

#define NR_PI2BPSK_SLICER_LINES_ROWS 1
#define NR_PI2BPSK_SLICER_LINES_FIELDS 2

static const int16_t nr_pi2bpsk_slicer_lines[NR_PI2BPSK_SLICER_LINES_ROWS][NR_PI2BPSK_SLICER_LINES_FIELDS] = {
    {16384, 16384},
};

#endif /* FIXMOD_NR_PI2BPSK_SLICER_LINES_H */
