/**
 * The fixmod application: golden vectors, device comparison, quantization-loss reports and the command line.
 * Depends on the kernel and on general-purpose libraries; nothing depends on it.
 * Sub-packages hold one idea each (cli, vectors, compare, loss, noise, theory, bench).
 */
package dev.fixmod.verify;
