/**
 * Comparison of a device's output dump with a golden vector set: streaming dump readers (hex, CSV, binary), the
 * alignment and field-wise comparison engine, fault diagnoses and the report in text and JSON.
 * Depends on the kernel's fixed-point types and on verify's vector-set model; the command line depends on it.
 */
package dev.fixmod.verify.compare;
