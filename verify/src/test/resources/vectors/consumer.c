/*
 * A C consumer of a fixmod vector set: includes the generated header of one port, reads the same port's raw
 * little-endian binary, checks that both hold the same values, and prints the SHA-256 of the header's values
 * serialized as little-endian integers (which must equal the manifest's SHA-256 of the .bin file).
 * Build: gcc -std=c99 -I<set> -DPORT_HEADER='"llr.h"' -DPORT_ARRAY=<id> -DPORT_COUNT=<ID>_ROWS
 *        -DPORT_FIELDS=<ID>_FIELDS consumer.c
 * SHA-256 as specified in FIPS 180-4, written for this test.
 */
#include <stdint.h>
#include <stdio.h>
#include <string.h>
#include PORT_HEADER

static const uint32_t K[64] = {
    0x428a2f98, 0x71374491, 0xb5c0fbcf, 0xe9b5dba5, 0x3956c25b, 0x59f111f1, 0x923f82a4, 0xab1c5ed5,
    0xd807aa98, 0x12835b01, 0x243185be, 0x550c7dc3, 0x72be5d74, 0x80deb1fe, 0x9bdc06a7, 0xc19bf174,
    0xe49b69c1, 0xefbe4786, 0x0fc19dc6, 0x240ca1cc, 0x2de92c6f, 0x4a7484aa, 0x5cb0a9dc, 0x76f988da,
    0x983e5152, 0xa831c66d, 0xb00327c8, 0xbf597fc7, 0xc6e00bf3, 0xd5a79147, 0x06ca6351, 0x14292967,
    0x27b70a85, 0x2e1b2138, 0x4d2c6dfc, 0x53380d13, 0x650a7354, 0x766a0abb, 0x81c2c92e, 0x92722c85,
    0xa2bfe8a1, 0xa81a664b, 0xc24b8b70, 0xc76c51a3, 0xd192e819, 0xd6990624, 0xf40e3585, 0x106aa070,
    0x19a4c116, 0x1e376c08, 0x2748774c, 0x34b0bcb5, 0x391c0cb3, 0x4ed8aa4a, 0x5b9cca4f, 0x682e6ff3,
    0x748f82ee, 0x78a5636f, 0x84c87814, 0x8cc70208, 0x90befffa, 0xa4506ceb, 0xbef9a3f7, 0xc67178f2};

typedef struct {
    uint32_t h[8];
    uint8_t block[64];
    size_t used;
    uint64_t length;
} sha256_t;

#define ROR(x, n) (((x) >> (n)) | ((x) << (32 - (n))))

static void sha256_block(sha256_t *s) {
    uint32_t w[64], a, b, c, d, e, f, g, h;
    int t;
    for (t = 0; t < 16; t++) {
        w[t] = (uint32_t)s->block[4 * t] << 24 | (uint32_t)s->block[4 * t + 1] << 16
             | (uint32_t)s->block[4 * t + 2] << 8 | s->block[4 * t + 3];
    }
    for (t = 16; t < 64; t++) {
        uint32_t s0 = ROR(w[t - 15], 7) ^ ROR(w[t - 15], 18) ^ (w[t - 15] >> 3);
        uint32_t s1 = ROR(w[t - 2], 17) ^ ROR(w[t - 2], 19) ^ (w[t - 2] >> 10);
        w[t] = w[t - 16] + s0 + w[t - 7] + s1;
    }
    a = s->h[0]; b = s->h[1]; c = s->h[2]; d = s->h[3]; e = s->h[4]; f = s->h[5]; g = s->h[6]; h = s->h[7];
    for (t = 0; t < 64; t++) {
        uint32_t t1 = h + (ROR(e, 6) ^ ROR(e, 11) ^ ROR(e, 25)) + ((e & f) ^ (~e & g)) + K[t] + w[t];
        uint32_t t2 = (ROR(a, 2) ^ ROR(a, 13) ^ ROR(a, 22)) + ((a & b) ^ (a & c) ^ (b & c));
        h = g; g = f; f = e; e = d + t1; d = c; c = b; b = a; a = t1 + t2;
    }
    s->h[0] += a; s->h[1] += b; s->h[2] += c; s->h[3] += d; s->h[4] += e; s->h[5] += f; s->h[6] += g; s->h[7] += h;
}

static void sha256_init(sha256_t *s) {
    static const uint32_t iv[8] = {0x6a09e667, 0xbb67ae85, 0x3c6ef372, 0xa54ff53a,
                                   0x510e527f, 0x9b05688c, 0x1f83d9ab, 0x5be0cd19};
    memcpy(s->h, iv, sizeof iv);
    s->used = 0;
    s->length = 0;
}

static void sha256_byte(sha256_t *s, uint8_t byte) {
    s->block[s->used++] = byte;
    s->length += 8;
    if (s->used == 64) {
        sha256_block(s);
        s->used = 0;
    }
}

static void sha256_final(sha256_t *s, char out[65]) {
    uint64_t length = s->length;
    int i;
    sha256_byte(s, 0x80);
    while (s->used != 56) {
        sha256_byte(s, 0);
    }
    for (i = 7; i >= 0; i--) {
        s->block[s->used++] = (uint8_t)(length >> (8 * i));
    }
    sha256_block(s);
    for (i = 0; i < 8; i++) {
        sprintf(out + 8 * i, "%08x", s->h[i]);
    }
}

int main(int argc, char **argv) {
    FILE *bin;
    sha256_t sha;
    char digest[65];
    unsigned long n, f, mismatches = 0;
    long long sum = 0;
    size_t width = sizeof PORT_ARRAY[0][0];
    if (argc != 2 || (bin = fopen(argv[1], "rb")) == NULL) {
        fprintf(stderr, "usage: consumer PORT.bin\n");
        return 2;
    }
    sha256_init(&sha);
    for (n = 0; n < PORT_COUNT; n++) {
        for (f = 0; f < PORT_FIELDS; f++) {
            long long v = (long long)PORT_ARRAY[n][f];
            unsigned char le[4];
            size_t b;
            if (fread(le, 1, width, bin) != width) {
                fprintf(stderr, "binary file ends at vector %lu\n", n);
                return 1;
            }
            for (b = 0; b < width; b++) {
                uint8_t byte = (uint8_t)((unsigned long long)v >> (8 * b));
                sha256_byte(&sha, byte);
                if (byte != le[b]) {
                    mismatches++;
                }
            }
            sum += v;
        }
    }
    if (fgetc(bin) != EOF) {
        fprintf(stderr, "binary file is longer than the header's %lu vectors\n", (unsigned long)PORT_COUNT);
        return 1;
    }
    fclose(bin);
    sha256_final(&sha, digest);
    printf("sha256 %s\nsum %lld\nmismatches %lu\n", digest, sum, mismatches);
    return mismatches == 0 ? 0 : 1;
}
