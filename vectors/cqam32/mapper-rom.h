/*
 * fixmod: set cqam32, mapper ROM: row = label, I and Q of the mapper output format
 * cqam32_mapper_rom: 32 rows x 2 fields, int16_t each, row-major. A code c of format Qm.n or UQm.n means c * 2^-n.
 *   [0] I: Q1.10 (signed, 12-bit word, 10 fractional bits, range [-2, 1.9990234375], LSB 2^-10)
 *   [1] Q: Q1.10 (signed, 12-bit word, 10 fractional bits, range [-2, 1.9990234375], LSB 2^-10)
 */
#ifndef FIXMOD_CQAM32_MAPPER_ROM_H
#define FIXMOD_CQAM32_MAPPER_ROM_H

#include <stdint.h>

#define CQAM32_MAPPER_ROM_ROWS 32
#define CQAM32_MAPPER_ROM_FIELDS 2

static const int16_t cqam32_mapper_rom[CQAM32_MAPPER_ROM_ROWS][CQAM32_MAPPER_ROM_FIELDS] = {
    {-687, -1145},
    {-229, -1145},
    {-687, 1145},
    {-229, 1145},
    {-1145, -687},
    {-1145, -229},
    {-1145, 687},
    {-1145, 229},
    {-229, -687},
    {-229, -229},
    {-229, 687},
    {-229, 229},
    {-687, -687},
    {-687, -229},
    {-687, 687},
    {-687, 229},
    {687, -1145},
    {229, -1145},
    {687, 1145},
    {229, 1145},
    {1145, -687},
    {1145, -229},
    {1145, 687},
    {1145, 229},
    {229, -687},
    {229, -229},
    {229, 687},
    {229, 229},
    {687, -687},
    {687, -229},
    {687, 687},
    {687, 229},
};

#endif /* FIXMOD_CQAM32_MAPPER_ROM_H */
