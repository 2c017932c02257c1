/*
 * fixmod: set wlan-qam1024, slicer thresholds on Q, ascending demapper input codes: x >= threshold takes the upper level
 * wlan_qam1024_slicer_thresholds_q: 31 rows x 1 fields, int16_t each, row-major. A code c of format Qm.n or UQm.n means c * 2^-n.
 *   [0] threshold: Q2.11 (signed, 14-bit word, 11 fractional bits, range [-4, 3.99951171875], LSB 2^-11)
 */
#ifndef FIXMOD_WLAN_QAM1024_SLICER_THRESHOLDS_Q_H
#define FIXMOD_WLAN_QAM1024_SLICER_THRESHOLDS_Q_H

#include <stdint.h>

#define WLAN_QAM1024_SLICER_THRESHOLDS_Q_ROWS 31
#define WLAN_QAM1024_SLICER_THRESHOLDS_Q_FIELDS 1

static const int16_t wlan_qam1024_slicer_thresholds_q[WLAN_QAM1024_SLICER_THRESHOLDS_Q_ROWS][WLAN_QAM1024_SLICER_THRESHOLDS_Q_FIELDS] = {
    {-2352},
    {-2195},
    {-2039},
    {-1882},
    {-1725},
    {-1568},
    {-1411},
    {-1254},
    {-1097},
    {-941},
    {-784},
    {-627},
    {-470},
    {-313},
    {-156},
    {0},
    {157},
    {314},
    {471},
    {628},
    {785},
    {941},
    {1098},
    {1255},
    {1412},
    {1569},
    {1726},
    {1883},
    {2039},
    {2196},
    {2353},
};

#endif /* FIXMOD_WLAN_QAM1024_SLICER_THRESHOLDS_Q_H */
