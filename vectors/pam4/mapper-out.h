/*
 * fixmod golden vectors: set pam4, port mapper-out (expected)
 * pam4_mapper_out: 68 rows x 2 fields, int16_t each, row-major. A code c of format Qm.n or UQm.n means c * 2^-n.
 *   [0] I: Q2.9 (signed, 12-bit word, 9 fractional bits, range [-4, 3.998046875], LSB 2^-9)
 *   [1] Q: Q2.9 (signed, 12-bit word, 9 fractional bits, range [-4, 3.998046875], LSB 2^-9)
 */
#ifndef FIXMOD_PAM4_MAPPER_OUT_H
#define FIXMOD_PAM4_MAPPER_OUT_H

#include <stdint.h>

#define PAM4_MAPPER_OUT_ROWS 68
#define PAM4_MAPPER_OUT_FIELDS 2

static const int16_t pam4_mapper_out[PAM4_MAPPER_OUT_ROWS][PAM4_MAPPER_OUT_FIELDS] = {
    {687, 0},
    {687, 0},
    {687, 0},
    {687, 0},
    {687, 0},
    {687, 0},
    {687, 0},
    {687, 0},
    {687, 0},
    {687, 0},
    {687, 0},
    {687, 0},
    {687, 0},
    {687, 0},
    {687, 0},
    {687, 0},
    {687, 0},
    {687, 0},
    {687, 0},
    {687, 0},
    {687, 0},
    {687, 0},
    {687, 0},
    {687, 0},
    {687, 0},
    {687, 0},
    {687, 0},
    {687, 0},
    {687, 0},
    {687, 0},
    {687, 0},
    {687, 0},
    {687, 0},
    {687, 0},
    {687, 0},
    {687, 0},
    {687, 0},
    {687, 0},
    {687, 0},
    {687, 0},
    {687, 0},
    {687, 0},
    {687, 0},
    {687, 0},
    {687, 0},
    {687, 0},
    {687, 0},
    {687, 0},
    {687, 0},
    {687, 0},
    {687, 0},
    {687, 0},
    {687, 0},
    {687, 0},
    {687, 0},
    {687, 0},
    {687, 0},
    {687, 0},
    {687, 0},
    {687, 0},
    {687, 0},
    {687, 0},
    {687, 0},
    {687, 0},
    {-687, 0},
    {-229, 0},
    {687, 0},
    {229, 0},
};

#endif /* FIXMOD_PAM4_MAPPER_OUT_H */
