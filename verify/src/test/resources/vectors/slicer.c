/*
 * A C testbench of a vector set's slicer tables: decides every demapper-in vector from the exported constants alone
 * and counts the rows where hard.h says otherwise. Without SECTOR: minimum distance to slicer-reference.h, ties to
 * the largest I, then the largest Q. With SECTOR: the M/2 tests a*I + b*Q >= 0 of slicer-lines.h; the decision is the
 * reference point whose tests give the same results (each sector has its own pattern of sides).
 * Build: gcc -std=c99 -I<set> -DSET=<table prefix, e.g. psk8> [-DSECTOR] slicer.c
 */
#include <stdint.h>
#include <stdio.h>
#include "demapper-in.h"
#include "hard.h"
#include "slicer-reference.h"
#ifdef SECTOR
#include "slicer-lines.h"
#endif

#define CAT(a, b) a##b
#define NAME(set, part) CAT(set, part)
#define IN NAME(SET, _demapper_in)
#define HARD NAME(SET, _hard)
#define REF NAME(SET, _slicer_reference)
#define LINES NAME(SET, _slicer_lines)
#define ROWS(a) (sizeof(a) / sizeof((a)[0]))

#ifdef SECTOR
static unsigned long long sides(long long i, long long q) {
    unsigned long long bits = 0;
    unsigned long j;
    for (j = 0; j < ROWS(LINES); j++) {
        long long t = (long long)LINES[j][0] * i + (long long)LINES[j][1] * q;
        bits |= (unsigned long long)(t >= 0) << j;
    }
    return bits;
}
#endif

int main(void) {
    unsigned long r, p, best, mismatches = 0;
    for (r = 0; r < ROWS(IN); r++) {
        long long i = IN[r][0], q = IN[r][1];
#ifdef SECTOR
        unsigned long long mine = sides(i, q);
        best = ROWS(REF);
        for (p = 0; p < ROWS(REF); p++) {
            if (sides(REF[p][0], REF[p][1]) == mine) {
                best = p;
            }
        }
#else
        long long bestDistance = -1;
        best = 0;
        for (p = 0; p < ROWS(REF); p++) {
            long long di = i - REF[p][0], dq = q - REF[p][1], d = di * di + dq * dq;
            if (bestDistance < 0 || d < bestDistance
                    || (d == bestDistance && (REF[p][0] > REF[best][0]
                            || (REF[p][0] == REF[best][0] && REF[p][1] > REF[best][1])))) {
                best = p;
                bestDistance = d;
            }
        }
#endif
        if (best != (unsigned long)HARD[r][0]) {
            mismatches++;
        }
    }
    printf("rows %lu\nmismatches %lu\n", (unsigned long)ROWS(IN), mismatches);
    return mismatches == 0 ? 0 : 1;
}
