/*
 * fixmod: set nr-qam64, mapper ROM: row = label, I and Q of the mapper output format
 * nr_qam64_mapper_rom: 64 rows x 2 fields, int16_t each, row-major. A code c of format Qm.n or UQm.n means c * 2^-n.
 *   [0] I: Q1.10 (signed, 12-bit word, 10 fractional bits, range [-2, 1.9990234375], LSB 2^-10)
 *   [1] Q: Q1.10 (signed, 12-bit word, 10 fractional bits, range [-2, 1.9990234375], LSB 2^-10)
 */
#ifndef FIXMOD_NR_QAM64_MAPPER_ROM_H
#define FIXMOD_NR_QAM64_MAPPER_ROM_H

#include <stdint.h>

#define NR_QAM64_MAPPER_ROM_ROWS 64
#define NR_QAM64_MAPPER_ROM_FIELDS 2

static const int16_t nr_qam64_mapper_rom[NR_QAM64_MAPPER_ROM_ROWS][NR_QAM64_MAPPER_ROM_FIELDS] = {
    {474, 474},
    {474, 158},
    {158, 474},
    {158, 158},
    {474, 790},
    {474, 1106},
    {158, 790},
    {158, 1106},
    {790, 474},
    {790, 158},
    {1106, 474},
    {1106, 158},
    {790, 790},
    {790, 1106},
    {1106, 790},
    {1106, 1106},
    {474, -474},
    {474, -158},
    {158, -474},
    {158, -158},
    {474, -790},
    {474, -1106},
    {158, -790},
    {158, -1106},
    {790, -474},
    {790, -158},
    {1106, -474},
    {1106, -158},
    {790, -790},
    {790, -1106},
    {1106, -790},
    {1106, -1106},
    {-474, 474},
    {-474, 158},
    {-158, 474},
    {-158, 158},
    {-474, 790},
    {-474, 1106},
    {-158, 790},
    {-158, 1106},
    {-790, 474},
    {-790, 158},
    {-1106, 474},
    {-1106, 158},
    {-790, 790},
    {-790, 1106},
    {-1106, 790},
    {-1106, 1106},
    {-474, -474},
    {-474, -158},
    {-158, -474},
    {-158, -158},
    {-474, -790},
    {-474, -1106},
    {-158, -790},
    {-158, -1106},
    {-790, -474},
    {-790, -158},
    {-1106, -474},
    {-1106, -158},
    {-790, -790},
    {-790, -1106},
    {-1106, -790},
    {-1106, -1106},
};

#endif /* FIXMOD_NR_QAM64_MAPPER_ROM_H */
