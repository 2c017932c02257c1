#!/usr/bin/env python3
"""Regenerates fixmod's noise (algorithm fixmod-noise-1) from its published description, noise-algorithm.md.

Standard library only. This is the proof that a testbench can reproduce the samples bit for bit without Java:
the Java test suite runs this script and compares its output with the Java implementation, value for value.

Usage:
  regenerate.py self-test
  regenerate.py uniform  --seed S --stream T --first F --count N [--open]
  regenerate.py gaussian --method box-muller|ziggurat --seed S --stream T --first F --count N
  regenerate.py awgn     --method box-muller|ziggurat --n0 N0 --seed S --stream T --first F --count N

Each output line holds one double as the 16 lowercase hex digits of its IEEE 754 bit pattern (awgn: I then Q,
separated by a space).

Java's StrictMath is specified as the fdlibm 5.3 algorithms. A platform libm (Python's math module) may differ
from fdlibm in the last bit, so the few functions the noise needs (log, exp, sin, cos) are transcribed below from
fdlibm's published algorithms, restricted to the arguments the noise can produce. Python floats are IEEE doubles
with round-to-nearest and no fused multiply-add, as Java's are; math.sqrt is correctly rounded in both.
"""

import argparse
import math
import struct
import sys

# --------------------------------------------------------------------------------------------------------------
# Philox4x32-10 (Salmon, Moraes, Dror, Shaw, SC'11)

MASK32 = 0xFFFFFFFF
M0, M1 = 0xD2511F53, 0xCD9E8D57
W0, W1 = 0x9E3779B9, 0xBB67AE85


def philox4x32_10(ctr, key):
    c0, c1, c2, c3 = ctr
    k0, k1 = key
    for r in range(10):
        if r:
            k0 = (k0 + W0) & MASK32
            k1 = (k1 + W1) & MASK32
        p0 = M0 * c0
        p1 = M1 * c2
        c0, c1, c2, c3 = (p1 >> 32) ^ c1 ^ k0, p1 & MASK32, (p0 >> 32) ^ c3 ^ k1, p0 & MASK32
    return c0, c1, c2, c3


def block(seed, stream, counter, draw_word=0):
    """fixmod layout: key = (seed, stream); counter = (index low, index high, draw word, 0)."""
    return philox4x32_10((counter & MASK32, counter >> 32, draw_word, 0), (seed, stream))


def draw(seed, stream, j):
    """64-bit draw j: words 2h (low half) and 2h+1 (high half) of primary block j >> 1, h = j & 1."""
    b = block(seed, stream, j >> 1)
    h = j & 1
    return b[2 * h] | (b[2 * h + 1] << 32)


def unit(bits):
    return (bits >> 11) * 2.0 ** -53


def open_unit(bits):
    return ((bits >> 11) | 1) * 2.0 ** -53


# --------------------------------------------------------------------------------------------------------------
# fdlibm 5.3 (Sun Microsystems; freely distributable), the algorithms java.lang.StrictMath specifies.

def _bits(x):
    return struct.unpack('<q', struct.pack('<d', x))[0]


def _hi(x):
    return _bits(x) >> 32  # signed high word


def _lo(x):
    return _bits(x) & MASK32


def _with_hi(x, high):
    return struct.unpack('<d', struct.pack('<Q', ((high & MASK32) << 32) | _lo(x)))[0]


def _from_words(high, low):
    return struct.unpack('<d', struct.pack('<Q', ((high & MASK32) << 32) | (low & MASK32)))[0]


_h = float.fromhex
LN2_HI = _h('0x1.62e42feep-1')
LN2_LO = _h('0x1.a39ef35793c76p-33')
LG1, LG2, LG3, LG4 = _h('0x1.5555555555593p-1'), _h('0x1.999999997fa04p-2'), _h('0x1.2492494229359p-2'), \
    _h('0x1.c71c51d8e78afp-3')
LG5, LG6, LG7 = _h('0x1.7466496cb03dep-3'), _h('0x1.39a09d078c69fp-3'), _h('0x1.2f112df3e5244p-3')


def fd_log(x):
    """fdlibm e_log.c for positive normal x (the noise never passes anything else)."""
    hx = _hi(x)
    if not (0x00100000 <= hx < 0x7FF00000):
        raise ValueError('log argument outside the supported range: %r' % x)
    k = (hx >> 20) - 1023
    hx &= 0x000FFFFF
    i = (hx + 0x95F64) & 0x100000
    x = _with_hi(x, hx | (i ^ 0x3FF00000))
    k += i >> 20
    f = x - 1.0
    if (0x000FFFFF & (2 + hx)) < 3:
        if f == 0.0:
            if k == 0:
                return 0.0
            dk = float(k)
            return dk * LN2_HI + dk * LN2_LO
        r = f * f * (0.5 - 0.33333333333333333 * f)
        if k == 0:
            return f - r
        dk = float(k)
        return dk * LN2_HI - ((r - dk * LN2_LO) - f)
    s = f / (2.0 + f)
    dk = float(k)
    z = s * s
    i = hx - 0x6147A
    w = z * z
    j = 0x6B851 - hx
    t1 = w * (LG2 + w * (LG4 + w * LG6))
    t2 = z * (LG1 + w * (LG3 + w * (LG5 + w * LG7)))
    i |= j
    r = t2 + t1
    if i > 0:
        hfsq = 0.5 * f * f
        if k == 0:
            return f - (hfsq - s * (hfsq + r))
        return dk * LN2_HI - ((hfsq - (s * (hfsq + r) + dk * LN2_LO)) - f)
    if k == 0:
        return f - s * (f - r)
    return dk * LN2_HI - ((s * (f - r) - dk * LN2_LO) - f)


EXP_LN2_HI = (_h('0x1.62e42feep-1'), -_h('0x1.62e42feep-1'))
EXP_LN2_LO = (_h('0x1.a39ef35793c76p-33'), -_h('0x1.a39ef35793c76p-33'))
INV_LN2 = _h('0x1.71547652b82fep0')
P1, P2, P3 = _h('0x1.555555555553ep-3'), -_h('0x1.6c16c16bebd93p-9'), _h('0x1.1566aaf25de2cp-14')
P4, P5 = -_h('0x1.bbd41c5d26bf1p-20'), _h('0x1.6376972bea4d0p-25')


def fd_exp(x):
    """fdlibm e_exp.c for |x| < 708 (the noise only passes -0.5*x*x with |x| below 4)."""
    hx = _hi(x)
    xsb = (hx >> 31) & 1
    hx &= 0x7FFFFFFF
    if hx >= 0x40862E42:
        raise ValueError('exp argument outside the supported range: %r' % x)
    k = 0
    hi = lo = 0.0
    if hx > 0x3FD62E42:
        if hx < 0x3FF0A2B2:
            hi = x - EXP_LN2_HI[xsb]
            lo = EXP_LN2_LO[xsb]
            k = 1 - xsb - xsb
        else:
            k = int(INV_LN2 * x + (0.5, -0.5)[xsb])
            t = float(k)
            hi = x - t * EXP_LN2_HI[0]
            lo = t * EXP_LN2_LO[0]
        x = hi - lo
    elif hx < 0x3E300000:
        return 1.0 + x
    t = x * x
    c = x - t * (P1 + t * (P2 + t * (P3 + t * (P4 + t * P5))))
    if k == 0:
        return 1.0 - ((x * c) / (c - 2.0) - x)
    y = 1.0 - ((lo - (x * c) / (2.0 - c)) - hi)
    return _with_hi(y, _hi(y) + (k << 20))  # k >= -1021 for every argument accepted above


S1, S2, S3 = -_h('0x1.5555555555549p-3'), _h('0x1.111111110f8a6p-7'), -_h('0x1.a01a019c161d5p-13')
S4, S5, S6 = _h('0x1.71de357b1fe7dp-19'), -_h('0x1.ae5e68a2b9cebp-26'), _h('0x1.5d93a5acfd57cp-33')
C1, C2, C3 = _h('0x1.555555555554cp-5'), -_h('0x1.6c16c16c15177p-10'), _h('0x1.a01a019cb159p-16')
C4, C5, C6 = -_h('0x1.27e4f809c52adp-22'), _h('0x1.1ee9ebdb4b1c4p-29'), -_h('0x1.8fae9be8838d4p-37')


def _kernel_sin(x, y, iy):
    ix = _hi(x) & 0x7FFFFFFF
    if ix < 0x3E400000 and int(x) == 0:
        return x
    z = x * x
    v = z * x
    r = S2 + z * (S3 + z * (S4 + z * (S5 + z * S6)))
    if iy == 0:
        return x + v * (S1 + z * r)
    return x - ((z * (0.5 * y - v * r) - y) - v * S1)


def _kernel_cos(x, y):
    ix = _hi(x) & 0x7FFFFFFF
    if ix < 0x3E400000 and int(x) == 0:
        return 1.0
    z = x * x
    r = z * (C1 + z * (C2 + z * (C3 + z * (C4 + z * (C5 + z * C6)))))
    if ix < 0x3FD33333:
        return 1.0 - (0.5 * z - (z * r - x * y))
    qx = 0.28125 if ix > 0x3FE90000 else _from_words(ix - 0x00200000, 0)
    hz = 0.5 * z - qx
    a = 1.0 - qx
    return a - (hz - (z * r - x * y))


INV_PIO2 = _h('0x1.45f306dc9c883p-1')
PIO2_1, PIO2_1T = _h('0x1.921fb544p0'), _h('0x1.0b4611a626331p-34')
PIO2_2, PIO2_2T = _h('0x1.0b4611a6p-34'), _h('0x1.3198a2e037073p-69')
PIO2_3, PIO2_3T = _h('0x1.3198a2ep-69'), _h('0x1.b839a252049c1p-104')
NPIO2_HW = (0x3FF921FB, 0x400921FB, 0x4012D97C, 0x401921FB)  # the first entries of fdlibm's table: all 0 <= x < 7 reaches


def _rem_pio2(x):
    """fdlibm e_rem_pio2.c for 0 <= x < 7 (the noise passes 2*pi*u with u in [0, 1)): returns n, y0, y1."""
    hx = _hi(x)
    ix = hx & 0x7FFFFFFF
    if hx < 0 or not x < 7.0:
        raise ValueError('sin/cos argument outside the supported range: %r' % x)
    if ix <= 0x3FE921FB:
        return 0, x, 0.0
    if ix < 0x4002D97C:
        z = x - PIO2_1
        if ix != 0x3FF921FB:
            y0 = z - PIO2_1T
            return 1, y0, (z - y0) - PIO2_1T
        z -= PIO2_2
        y0 = z - PIO2_2T
        return 1, y0, (z - y0) - PIO2_2T
    t = x
    n = int(t * INV_PIO2 + 0.5)
    fn = float(n)
    r = t - fn * PIO2_1
    w = fn * PIO2_1T
    y0 = r - w
    if ix == NPIO2_HW[n - 1]:
        j = ix >> 20
        i = j - ((_hi(y0) >> 20) & 0x7FF)
        if i > 16:
            t = r
            w = fn * PIO2_2
            r = t - w
            w = fn * PIO2_2T - ((t - r) - w)
            y0 = r - w
            i = j - ((_hi(y0) >> 20) & 0x7FF)
            if i > 49:
                t = r
                w = fn * PIO2_3
                r = t - w
                w = fn * PIO2_3T - ((t - r) - w)
                y0 = r - w
    return n, y0, (r - y0) - w


def fd_sin(x):
    if (_hi(x) & 0x7FFFFFFF) <= 0x3FE921FB:
        return _kernel_sin(x, 0.0, 0)
    n, y0, y1 = _rem_pio2(x)
    return (_kernel_sin(y0, y1, 1), _kernel_cos(y0, y1), -_kernel_sin(y0, y1, 1), -_kernel_cos(y0, y1))[n & 3]


def fd_cos(x):
    if (_hi(x) & 0x7FFFFFFF) <= 0x3FE921FB:
        return _kernel_cos(x, 0.0)
    n, y0, y1 = _rem_pio2(x)
    return (_kernel_cos(y0, y1), -_kernel_sin(y0, y1, 1), -_kernel_cos(y0, y1), _kernel_sin(y0, y1, 1))[n & 3]


# --------------------------------------------------------------------------------------------------------------
# Gaussian samplers

TWO_PI = _h('0x1.921fb54442d18p2')


def box_muller(seed, stream, n):
    b = block(seed, stream, n >> 1)
    u1 = open_unit(b[0] | (b[1] << 32))
    u2 = unit(b[2] | (b[3] << 32))
    r = math.sqrt(-2.0 * fd_log(u1))
    theta = TWO_PI * u2
    return r * fd_cos(theta) if n & 1 == 0 else r * fd_sin(theta)


ZIG_LAYERS = 128
ZIG_R = 3.442619855899
ZIG_V = 9.91256303526217e-3


def _f(x):
    return fd_exp(-0.5 * x * x)


ZIG_X = [0.0] * (ZIG_LAYERS + 1)
ZIG_X[0] = ZIG_V / _f(ZIG_R)
ZIG_X[1] = ZIG_R
for _i in range(1, ZIG_LAYERS - 1):
    ZIG_X[_i + 1] = math.sqrt(-2.0 * fd_log(ZIG_V / ZIG_X[_i] + _f(ZIG_X[_i])))
ZIG_X[ZIG_LAYERS] = 0.0
ZIG_Y = [0.0] + [_f(x) for x in ZIG_X[1:]]


def _words(seed, stream, n):
    """The word sequence of Gaussian n: primary draw n, then retry blocks (counter n, draw word 1, 2, ...)."""
    yield draw(seed, stream, n)
    k = 1
    while True:
        b = block(seed, stream, n, k)
        yield b[0] | (b[1] << 32)
        yield b[2] | (b[3] << 32)
        k += 1


def ziggurat(seed, stream, n):
    words = _words(seed, stream, n)
    w = next(words)
    while True:
        i = w & (ZIG_LAYERS - 1)
        negative = (w >> 7) & 1
        x = unit(w) * ZIG_X[i]
        if x < ZIG_X[i + 1]:
            return -x if negative else x
        if i == 0:
            while True:
                s = -fd_log(open_unit(next(words))) / ZIG_R
                t = -fd_log(open_unit(next(words)))
                if t + t >= s * s:
                    return -(ZIG_R + s) if negative else ZIG_R + s
        v = unit(next(words))
        if ZIG_Y[i] + v * (ZIG_Y[i + 1] - ZIG_Y[i]) < _f(x):
            return -x if negative else x
        w = next(words)


METHODS = {'box-muller': box_muller, 'ziggurat': ziggurat}


# --------------------------------------------------------------------------------------------------------------

def hex_bits(x):
    return struct.pack('>d', x).hex()


def self_test():
    # Random123 tests/kat_vectors, "philox4x32 10" lines.
    kats = [((0, 0, 0, 0), (0, 0), (0x6627e8d5, 0xe169c58d, 0xbc57ac4c, 0x9b00dbd8)),
            ((MASK32,) * 4, (MASK32,) * 2, (0x408f276d, 0x41c83b0e, 0xa20bc7c6, 0x6d5451fd)),
            ((0x243f6a88, 0x85a308d3, 0x13198a2e, 0x03707344), (0xa4093822, 0x299f31d0),
             (0xd16cfe09, 0x94fdcceb, 0x5001e420, 0x24126ea1))]
    for ctr, key, want in kats:
        got = philox4x32_10(ctr, key)
        if got != want:
            sys.exit('Philox4x32-10 known answer failed for counter %s key %s: got %s' % (ctr, key, got))
    print('ok')


def main(argv):
    parser = argparse.ArgumentParser(description='Regenerates fixmod noise (fixmod-noise-1).')
    sub = parser.add_subparsers(dest='command', required=True)
    sub.add_parser('self-test')
    for name in ('uniform', 'gaussian', 'awgn'):
        p = sub.add_parser(name)
        p.add_argument('--seed', type=int, required=True)
        p.add_argument('--stream', type=int, required=True)
        p.add_argument('--first', type=int, required=True)
        p.add_argument('--count', type=int, required=True)
        if name == 'uniform':
            p.add_argument('--open', action='store_true')
        else:
            p.add_argument('--method', choices=sorted(METHODS), required=True)
        if name == 'awgn':
            p.add_argument('--n0', type=float, required=True)
    args = parser.parse_args(argv)
    if args.command == 'self-test':
        self_test()
        return
    out = []
    if args.command == 'uniform':
        convert = open_unit if args.open else unit
        for j in range(args.first, args.first + args.count):
            out.append(hex_bits(convert(draw(args.seed, args.stream, j))))
    elif args.command == 'gaussian':
        sample = METHODS[args.method]
        for n in range(args.first, args.first + args.count):
            out.append(hex_bits(sample(args.seed, args.stream, n)))
    else:
        sample = METHODS[args.method]
        sigma = math.sqrt(args.n0 / 2.0)
        for m in range(args.first, args.first + args.count):
            i = sigma * sample(args.seed, args.stream, 2 * m)
            q = sigma * sample(args.seed, args.stream, 2 * m + 1)
            out.append(hex_bits(i) + ' ' + hex_bits(q))
    sys.stdout.write('\n'.join(out) + ('\n' if out else ''))


if __name__ == '__main__':
    main(sys.argv[1:])
