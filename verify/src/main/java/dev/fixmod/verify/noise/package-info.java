/**
 * Reproducible randomness: the Philox4x32-10 counter-based generator keyed by (seed, stream), uniform and Gaussian
 * samples addressed by index (so any chunk is computed independently of thread count), and complex AWGN.
 * Depends only on java.base; the vector generator and the Monte Carlo engine depend on it.
 */
package dev.fixmod.verify.noise;
