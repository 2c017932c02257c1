/**
 * The ideal curves that simulated and fixed-point results are drawn and checked against: error rates, capacities,
 * confidence intervals for counted error rates, SNR conversions and the SNR at which a curve meets a target.
 * Depends on the kernel's constellation package and on Apache Commons Math; the Monte Carlo engine, the loss
 * report and the command line depend on it.
 */
package dev.fixmod.verify.theory;
