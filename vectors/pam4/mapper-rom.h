/*
 * fixmod: set pam4, mapper ROM: row = label, I and Q of the mapper output format
 * pam4_mapper_rom: 4 rows x 2 fields, int16_t each, row-major. A code c of format Qm.n or UQm.n means c * 2^-n.
 *   [0] I: Q2.9 (signed, 12-bit word, 9 fractional bits, range [-4, 3.998046875], LSB 2^-9)
 *   [1] Q: Q2.9 (signed, 12-bit word, 9 fractional bits, range [-4, 3.998046875], LSB 2^-9)
 */
#ifndef FIXMOD_PAM4_MAPPER_ROM_H
#define FIXMOD_PAM4_MAPPER_ROM_H

#include <stdint.h>

#define PAM4_MAPPER_ROM_ROWS 4
#define PAM4_MAPPER_ROM_FIELDS 2

static const int16_t pam4_mapper_rom[PAM4_MAPPER_ROM_ROWS][PAM4_MAPPER_ROM_FIELDS] = {
    {-687, 0},
    {-229, 0},
    {687, 0},
    {229, 0},
};

#endif /* FIXMOD_PAM4_MAPPER_ROM_H */
