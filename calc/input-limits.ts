/**
 * The engine's input limits, named once. Every list and text an input may carry is bounded, so
 * one request cannot tie up the server or answer with megabytes: the wizard's own limits (a real
 * device has far fewer radios), generous for the lab's data. Limits are product choices, not
 * taken from a standard.
 */

/** Labels of antennas, transmitters, positions and rows. */
export const MAX_ID_CHARS = 40;
/** Free text in a calculation input (a test position, a channel, a serial). */
export const MAX_TEXT_CHARS = 200;

// A device, as the wizard holds it.
export const MAX_TRANSMITTERS = 64;
export const MAX_ANTENNAS = 32;
export const MAX_USE_POSITIONS = 24;
/** Certified modules inside one host. */
export const MAX_MODULES = 8;

// A lab's data for one filing version.
export const MAX_MEASUREMENTS = 5000;
export const MAX_CHECK_RECORDS = 1000;
export const MAX_INSTRUMENTS = 500;
export const MAX_UNCERTAINTY_COMPONENTS = 100;
/** Transmitter combinations that can be on together, and members of one combination. */
export const MAX_COMBINATIONS = 256;
export const MAX_COMBINATION_MEMBERS = 16;
/** Screening rows handed to the lab-results calculation: transmitters × positions × markets. */
export const MAX_SCREENING_ROWS = MAX_TRANSMITTERS * MAX_USE_POSITIONS * 4;

/** Sources summed at one point (MPE sum of ratios), and transmitters in one co-transmission sum. */
export const MAX_MPE_SOURCES = 256;
export const MAX_CO_TRANSMITTERS = 64;

/** Field problems reported for one refused input; the rest are counted, not listed. */
export const MAX_REPORTED_PROBLEMS = 200;
