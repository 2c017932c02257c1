/*
 * fixmod: set nr-qam64, slicer reference points: row = label, I and Q in demapper input codes
 * (the points every slicer and the LLR datapath compare with; even symbols)
 * nr_qam64_slicer_reference: 64 rows x 2 fields, int16_t each, row-major. A code c of format Qm.n or UQm.n means c * 2^-n.
 *   [0] I: Q2.9 (signed, 12-bit word, 9 fractional bits, range [-4, 3.998046875], LSB 2^-9)
 *   [1] Q: Q2.9 (signed, 12-bit word, 9 fractional bits, range [-4, 3.998046875], LSB 2^-9)
 */
#ifndef FIXMOD_NR_QAM64_SLICER_REFERENCE_H
#define FIXMOD_NR_QAM64_SLICER_REFERENCE_H

#include <stdint.h>

#define NR_QAM64_SLICER_REFERENCE_ROWS 64
#define NR_QAM64_SLICER_REFERENCE_FIELDS 2

static const int16_t nr_qam64_slicer_reference[NR_QAM64_SLICER_REFERENCE_ROWS][NR_QAM64_SLICER_REFERENCE_FIELDS] = {
    {237, 237},
    {237, 79},
    {79, 237},
    {79, 79},
    {237, 395},
    {237, 553},
    {79, 395},
    {79, 553},
    {395, 237},
    {395, 79},
    {553, 237},
    {553, 79},
    {395, 395},
    {395, 553},
    {553, 395},
    {553, 553},
    {237, -237},
    {237, -79},
    {79, -237},
    {79, -79},
    {237, -395},
    {237, -553},
    {79, -395},
    {79, -553},
    {395, -237},
    {395, -79},
    {553, -237},
    {553, -79},
    {395, -395},
    {395, -553},
    {553, -395},
    {553, -553},
    {-237, 237},
    {-237, 79},
    {-79, 237},
    {-79, 79},
    {-237, 395},
    {-237, 553},
    {-79, 395},
    {-79, 553},
    {-395, 237},
    {-395, 79},
    {-553, 237},
    {-553, 79},
    {-395, 395},
    {-395, 553},
    {-553, 395},
    {-553, 553},
    {-237, -237},
    {-237, -79},
    {-79, -237},
    {-79, -79},
    {-237, -395},
    {-237, -553},
    {-79, -395},
    {-79, -553},
    {-395, -237},
    {-395, -79},
    {-553, -237},
    {-553, -79},
    {-395, -395},
    {-395, -553},
    {-553, -395},
    {-553, -553},
};

#endif /* FIXMOD_NR_QAM64_SLICER_REFERENCE_H */
