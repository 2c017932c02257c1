/*
 * fixmod golden vectors: set pam4, port bits (stimulus)
 * pam4_bits: 68 rows x 1 fields, uint8_t each, row-major. A code c of format Qm.n or UQm.n means c * 2^-n.
 *   [0] label: UQ2.0 (unsigned, 2-bit word, 0 fractional bits, range [0, 3], LSB 1)
 */
#ifndef FIXMOD_PAM4_BITS_H
#define FIXMOD_PAM4_BITS_H

#include <stdint.h>

#define PAM4_BITS_ROWS 68
#define PAM4_BITS_FIELDS 1

static const uint8_t pam4_bits[PAM4_BITS_ROWS][PAM4_BITS_FIELDS] = {
    {2u},
    {2u},
    {2u},
    {2u},
    {2u},
    {2u},
    {2u},
    {2u},
    {2u},
    {2u},
    {2u},
    {2u},
    {2u},
    {2u},
    {2u},
    {2u},
    {2u},
    {2u},
    {2u},
    {2u},
    {2u},
    {2u},
    {2u},
    {2u},
    {2u},
    {2u},
    {2u},
    {2u},
    {2u},
    {2u},
    {2u},
    {2u},
    {2u},
    {2u},
    {2u},
    {2u},
    {2u},
    {2u},
    {2u},
    {2u},
    {2u},
    {2u},
    {2u},
    {2u},
    {2u},
    {2u},
    {2u},
    {2u},
    {2u},
    {2u},
    {2u},
    {2u},
    {2u},
    {2u},
    {2u},
    {2u},
    {2u},
    {2u},
    {2u},
    {2u},
    {2u},
    {2u},
    {2u},
    {2u},
    {0u},
    {1u},
    {2u},
    {3u},
};

#endif /* FIXMOD_PAM4_BITS_H */
