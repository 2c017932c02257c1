/*
 * fixmod: set nr-pi2bpsk, mapper ROM: row = label, I and Q of the mapper output format
 * nr_pi2bpsk_mapper_rom: 2 rows x 2 fields, int16_t each, row-major. A code c of format Qm.n or UQm.n means c * 2^-n.
 *   [0] I: Q1.10 (signed, 12-bit word, 10 fractional bits, range [-2, 1.9990234375], LSB 2^-10)
 *   [1] Q: Q1.10 (signed, 12-bit word, 10 fractional bits, range [-2, 1.9990234375], LSB 2^-10)
 */
#ifndef FIXMOD_NR_PI2BPSK_MAPPER_ROM_H
#define FIXMOD_NR_PI2BPSK_MAPPER_ROM_H

#include <stdint.h>

#define NR_PI2BPSK_MAPPER_ROM_ROWS 2
#define NR_PI2BPSK_MAPPER_ROM_FIELDS 2

static const int16_t nr_pi2bpsk_mapper_rom[NR_PI2BPSK_MAPPER_ROM_ROWS][NR_PI2BPSK_MAPPER_ROM_FIELDS] = {
    {724, 724},
    {-724, -724},
};

#endif /* FIXMOD_NR_PI2BPSK_MAPPER_ROM_H */
