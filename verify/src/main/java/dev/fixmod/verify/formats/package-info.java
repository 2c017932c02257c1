/**
 * Writers of the files testbenches read — hex lines for $readmemh/hread, CSV, raw little-endian binary, C headers,
 * NumPy .npy — streaming and byte-for-byte deterministic, plus atomic vector-set folders with SHA-256 of each file.
 * Depends on the kernel's fixed-point formats and java.base; the vector generator and the CLI depend on it.
 */
package dev.fixmod.verify.formats;
