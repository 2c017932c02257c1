/**
 * User-defined constellations read from CSV and JSON files, and the human and machine renderings of a constellation
 * with its ideal metrics. Depends on the kernel's constellation package and on Jackson; the command line uses it.
 */
package dev.fixmod.verify.constellation;
