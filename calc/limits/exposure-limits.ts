/**
 * Field and power-density exposure limits (MPE / reference levels) against frequency.
 *
 * Tables
 * - FCC: 47 CFR §1.1310 Table 1 — (A) occupational/controlled, (B) general population/uncontrolled
 *  .
 * - ISED: RSS-102 Issue 5 Table 4 (general public / uncontrolled) and Table 5 (controlled) =
 *   Health Canada Safety Code 6 (2015) Tables 5 and 6 (RSS-102 Issue 5 Tables 4–5, from memory: from memory).
 * - ICNIRP 1998 (Health Phys. 74(4):494–522): Table 7 general public, Table 6 occupational
 *   (ICNIRP 1998 Tables 6–7; public C, occupational partly, from memory).
 * - ICNIRP 2020 (Health Phys. 118(5):483–524): Table 5 whole-body, 30 min (from memory)
 *   and Table 6 local, 6 min .
 *
 * Frequencies inside the tables are in MHz (f_M) or GHz (f_G) as the source prints them; the
 * functions take Hz. A row "a – b" covers a < f ≤ b (ICNIRP 2020 prints this as "> a – b"); the
 * first row of each table also includes its lower edge. Where the source leaves a cell empty
 * ("—" or "NA") the result is null and the notes say so.
 */
import { z } from 'zod';
import { defineCalculation, type Derivation, CalcRangeError } from '../types';
import { q } from '../types';
import { formatHz, inInterval, type Interval } from './range';

export const exposureRegimes = ['fcc', 'ised', 'icnirp-1998', 'icnirp-2020'] as const;
export type ExposureRegime = (typeof exposureRegimes)[number];
export const tiers = ['general', 'occupational'] as const;
export type Tier = (typeof tiers)[number];
export const exposureKinds = ['whole-body', 'local'] as const;
export type ExposureKind = (typeof exposureKinds)[number];

interface Cell {
  at: (fMHz: number) => number;
  /** The cell as the source prints it. */
  text: string;
}
interface Row {
  /** MHz; see `interval` for which edges belong to the row. */
  interval: Interval;
  label: string;
  E: Cell | null;
  H: Cell | null;
  /** Power density in W/m² (FCC cells are converted from mW/cm², 1 mW/cm² = 10 W/m²). */
  S: Cell | null;
  averagingMin: Cell;
  notes?: string[];
}
interface LimitTable {
  source: string;
  /** Reference status of the table's values. */
  status: string;
  rows: Row[];
  /** Limits that apply alongside the time-averaged row at the same frequency (e.g. nerve stimulation). */
  additional?: (fMHz: number) => AdditionalLimit[];
  /** Frequencies (MHz) inside a row where the averaging time formula changes. */
  averagingBreakpointsMHz?: number[];
}

export interface AdditionalLimit {
  basis: string;
  electricFieldVPerM: number | null;
  magneticFieldAPerM: number | null;
  averaging: string;
}

const k = (v: number, text = `${v}`): Cell => ({ at: () => v, text });
const fn = (at: (fMHz: number) => number, text: string): Cell => ({ at, text });
/** FCC Table 1 prints S in mW/cm²; 1 mW/cm² = 10 W/m² (SI unit conversion). */
const mwcm2 = (at: (fMHz: number) => number, text: string): Cell => ({
  at: (f) => at(f) * 10,
  text: `${text} mW/cm²`,
});

/** Rows a – b as (a, b]; the first row of a table is [a, b]. */
function rows(list: (Omit<Row, 'interval'> & { from: number; to: number; interval?: Interval })[]): Row[] {
  return list.map(({ from, to, interval, ...rest }, i) => ({
    ...rest,
    interval: interval ?? { min: from, max: to, minInclusive: i === 0, maxInclusive: true },
  }));
}

const SIX_MIN = k(6);
const FCC_PLANE_WAVE = 'S is the plane-wave equivalent power density (marked * in §1.1310 Table 1).';
const FCC_NO_FIELDS = '§1.1310 Table 1 gives no E or H limit in this range (only power density).';

// 47 CFR §1.1310 Table 1 (A) — occupational/controlled exposure.
const fccOccupational: LimitTable = {
  source: '47 CFR §1.1310 Table 1 (A), limits for occupational/controlled exposure',
  status: 'C (regulation text)',
  rows: rows([
    { from: 0.3, to: 3, label: '0.3–3.0 MHz', E: k(614), H: k(1.63), S: mwcm2(() => 100, '(100)'), averagingMin: SIX_MIN, notes: [FCC_PLANE_WAVE] },
    {
      from: 3,
      to: 30,
      label: '3.0–30 MHz',
      E: fn((f) => 1842 / f, '1842/f'),
      H: fn((f) => 4.89 / f, '4.89/f'),
      S: mwcm2((f) => 900 / f ** 2, '(900/f²)'),
      averagingMin: SIX_MIN,
      notes: [FCC_PLANE_WAVE],
    },
    { from: 30, to: 300, label: '30–300 MHz', E: k(61.4), H: k(0.163), S: mwcm2(() => 1.0, '1.0'), averagingMin: SIX_MIN },
    { from: 300, to: 1500, label: '300–1,500 MHz', E: null, H: null, S: mwcm2((f) => f / 300, 'f/300'), averagingMin: SIX_MIN, notes: [FCC_NO_FIELDS] },
    { from: 1500, to: 100_000, label: '1,500–100,000 MHz', E: null, H: null, S: mwcm2(() => 5, '5'), averagingMin: SIX_MIN, notes: [FCC_NO_FIELDS] },
  ]),
};

// 47 CFR §1.1310 Table 1 (B) — general population/uncontrolled exposure.
const THIRTY_MIN = k(30);
const fccGeneral: LimitTable = {
  source: '47 CFR §1.1310 Table 1 (B), limits for general population/uncontrolled exposure',
  status: 'C (regulation text)',
  rows: rows([
    { from: 0.3, to: 1.34, label: '0.3–1.34 MHz', E: k(614), H: k(1.63), S: mwcm2(() => 100, '(100)'), averagingMin: THIRTY_MIN, notes: [FCC_PLANE_WAVE] },
    {
      from: 1.34,
      to: 30,
      label: '1.34–30 MHz',
      E: fn((f) => 824 / f, '824/f'),
      H: fn((f) => 2.19 / f, '2.19/f'),
      S: mwcm2((f) => 180 / f ** 2, '(180/f²)'),
      averagingMin: THIRTY_MIN,
      notes: [FCC_PLANE_WAVE],
    },
    { from: 30, to: 300, label: '30–300 MHz', E: k(27.5), H: k(0.073), S: mwcm2(() => 0.2, '0.2'), averagingMin: THIRTY_MIN },
    { from: 300, to: 1500, label: '300–1,500 MHz', E: null, H: null, S: mwcm2((f) => f / 1500, 'f/1500'), averagingMin: THIRTY_MIN, notes: [FCC_NO_FIELDS] },
    { from: 1500, to: 100_000, label: '1,500–100,000 MHz', E: null, H: null, S: mwcm2(() => 1.0, '1.0'), averagingMin: THIRTY_MIN, notes: [FCC_NO_FIELDS] },
  ]),
};

// ICNIRP 1998: E², H², S averaged over 6 min up to 10 GHz, over 68/f_G^1.05 min above (ICNIRP 1998 Tables 4 and 7).
const icnirp1998Averaging = fn((f) => (f <= 10_000 ? 6 : 68 / (f / 1000) ** 1.05), '6 (f ≤ 10 GHz); 68/f_G^1.05 (f > 10 GHz)');
const NO_S_1998 = 'ICNIRP 1998 gives no equivalent plane-wave power density below 10 MHz.';

// ICNIRP 1998 Table 7, general public (ICNIRP 1998 Table 7; = 1999/519/EC Annex III).
const icnirp1998General: LimitTable = {
  averagingBreakpointsMHz: [10_000],
  source: 'ICNIRP 1998 (Health Phys. 74(4):494–522) Table 7, reference levels for general public exposure (= 1999/519/EC Annex III)',
  status: 'C',
  rows: rows([
    { from: 0.1, to: 0.15, label: '3–150 kHz row (from 100 kHz)', E: k(87), H: k(5), S: null, averagingMin: icnirp1998Averaging, notes: [NO_S_1998] },
    { from: 0.15, to: 1, label: '0.15–1 MHz', E: k(87), H: fn((f) => 0.73 / f, '0.73/f'), S: null, averagingMin: icnirp1998Averaging, notes: [NO_S_1998] },
    { from: 1, to: 10, label: '1–10 MHz', E: fn((f) => 87 / f ** 0.5, '87/f^½'), H: fn((f) => 0.73 / f, '0.73/f'), S: null, averagingMin: icnirp1998Averaging, notes: [NO_S_1998] },
    { from: 10, to: 400, label: '10–400 MHz', E: k(28), H: k(0.073), S: k(2), averagingMin: icnirp1998Averaging },
    {
      from: 400,
      to: 2000,
      label: '400–2000 MHz',
      E: fn((f) => 1.375 * f ** 0.5, '1.375 f^½'),
      H: fn((f) => 0.0037 * f ** 0.5, '0.0037 f^½'),
      S: fn((f) => f / 200, 'f/200'),
      averagingMin: icnirp1998Averaging,
    },
    { from: 2000, to: 300_000, label: '2–300 GHz', E: k(61), H: k(0.16), S: k(10), averagingMin: icnirp1998Averaging },
  ]),
};

// ICNIRP 1998 Table 6, occupational (E and S secondary-confirmed, H partly from memory).
const H_FROM_MEMORY = 'H from memory (ICNIRP 1998 Table 6); E and S_eq confirmed from a secondary source.';
const icnirp1998Occupational: LimitTable = {
  averagingBreakpointsMHz: [10_000],
  source: 'ICNIRP 1998 (Health Phys. 74(4):494–522) Table 6, reference levels for occupational exposure',
  status: 'E, S_eq: S (secondary source); H: M (from memory)',
  rows: rows([
    { from: 0.1, to: 1, label: '0.065–1 MHz row (from 100 kHz)', E: k(610), H: fn((f) => 1.6 / f, '1.6/f'), S: null, averagingMin: icnirp1998Averaging, notes: [NO_S_1998, H_FROM_MEMORY] },
    { from: 1, to: 10, label: '1–10 MHz', E: fn((f) => 610 / f, '610/f'), H: fn((f) => 1.6 / f, '1.6/f'), S: null, averagingMin: icnirp1998Averaging, notes: [NO_S_1998, H_FROM_MEMORY] },
    { from: 10, to: 400, label: '10–400 MHz', E: k(61), H: k(0.16), S: k(10), averagingMin: icnirp1998Averaging, notes: [H_FROM_MEMORY] },
    {
      from: 400,
      to: 2000,
      label: '400–2000 MHz',
      E: fn((f) => 3 * f ** 0.5, '3 f^½'),
      H: fn((f) => 0.008 * f ** 0.5, '0.008 f^½'),
      S: fn((f) => f / 40, 'f/40'),
      averagingMin: icnirp1998Averaging,
      notes: ['E and H from memory (ICNIRP 1998 Table 6); S_eq confirmed from a secondary source.'],
    },
    {
      from: 2000,
      to: 300_000,
      label: '2–300 GHz',
      E: k(137),
      H: k(0.36),
      S: k(50),
      averagingMin: icnirp1998Averaging,
      notes: ['E and H from memory (ICNIRP 1998 Table 6); S_eq confirmed from a secondary source.'],
    },
  ]),
};

const NA_2020 = 'ICNIRP 2020 prints NA for this quantity in this range.';
// ICNIRP 2020 Table 5, whole-body exposure, averaged over 30 min (from memory).
const icnirp2020WholeBodyOccupational: LimitTable = {
  source: 'ICNIRP 2020 (Health Phys. 118(5):483–524) Table 5, whole-body reference levels, occupational, 30 min',
  status: 'M (from memory)',
  rows: rows([
    { from: 0.1, to: 30, label: '0.1–30 MHz', E: fn((f) => 660 / f ** 0.7, '660/f_M^0.7'), H: fn((f) => 4.9 / f, '4.9/f_M'), S: null, averagingMin: THIRTY_MIN, notes: [NA_2020] },
    { from: 30, to: 400, label: '>30–400 MHz', E: k(61), H: k(0.16), S: k(10), averagingMin: THIRTY_MIN },
    { from: 400, to: 2000, label: '>400–2000 MHz', E: fn((f) => 3 * f ** 0.5, '3 f_M^0.5'), H: fn((f) => 0.008 * f ** 0.5, '0.008 f_M^0.5'), S: fn((f) => f / 40, 'f_M/40'), averagingMin: THIRTY_MIN },
    { from: 2000, to: 300_000, label: '>2–300 GHz', E: null, H: null, S: k(50), averagingMin: THIRTY_MIN, notes: [NA_2020] },
  ]),
};
const icnirp2020WholeBodyGeneral: LimitTable = {
  source: 'ICNIRP 2020 (Health Phys. 118(5):483–524) Table 5, whole-body reference levels, general public, 30 min',
  status: 'M (from memory)',
  rows: rows([
    { from: 0.1, to: 30, label: '0.1–30 MHz', E: fn((f) => 300 / f ** 0.7, '300/f_M^0.7'), H: fn((f) => 2.2 / f, '2.2/f_M'), S: null, averagingMin: THIRTY_MIN, notes: [NA_2020] },
    { from: 30, to: 400, label: '>30–400 MHz', E: k(27.7), H: k(0.073), S: k(2), averagingMin: THIRTY_MIN },
    {
      from: 400,
      to: 2000,
      label: '>400–2000 MHz',
      E: fn((f) => 1.375 * f ** 0.5, '1.375 f_M^0.5'),
      H: fn((f) => 0.0037 * f ** 0.5, '0.0037 f_M^0.5'),
      S: fn((f) => f / 200, 'f_M/200'),
      averagingMin: THIRTY_MIN,
    },
    { from: 2000, to: 300_000, label: '>2–300 GHz', E: null, H: null, S: k(10), averagingMin: THIRTY_MIN, notes: [NA_2020] },
  ]),
};

// ICNIRP 2020 Table 6, local exposure, averaged over 6 min .
// ">6 – <300 GHz" excludes 300 GHz, which has its own row.
const lastRows = (sixTo300: Cell, at300: number) => [
  {
    from: 6000,
    to: 300_000,
    interval: { min: 6000, max: 300_000, minInclusive: false, maxInclusive: false },
    label: '>6–<300 GHz',
    E: null,
    H: null,
    S: sixTo300,
    averagingMin: SIX_MIN,
    notes: [NA_2020, 'Above 6 GHz S_inc is averaged over a 4 cm² square projected area (ICNIRP 2020 Table 6, from memory).'],
  },
  { from: 300_000, to: 300_000, interval: { min: 300_000, max: 300_000 }, label: '300 GHz', E: null, H: null, S: k(at300), averagingMin: SIX_MIN, notes: [NA_2020] },
];
const icnirp2020LocalOccupational: LimitTable = {
  source: 'ICNIRP 2020 (Health Phys. 118(5):483–524) Table 6, local reference levels, occupational, 6 min',
  status: 'C',
  rows: rows([
    { from: 0.1, to: 30, label: '0.1–30 MHz', E: fn((f) => 1504 / f ** 0.7, '1504/f_M^0.7'), H: fn((f) => 10.8 / f, '10.8/f_M'), S: null, averagingMin: SIX_MIN, notes: [NA_2020] },
    { from: 30, to: 400, label: '>30–400 MHz', E: k(139), H: k(0.36), S: k(50), averagingMin: SIX_MIN },
    {
      from: 400,
      to: 2000,
      label: '>400–2000 MHz',
      E: fn((f) => 10.58 * f ** 0.43, '10.58 f_M^0.43'),
      H: fn((f) => 0.0274 * f ** 0.43, '0.0274 f_M^0.43'),
      S: fn((f) => 0.29 * f ** 0.86, '0.29 f_M^0.86'),
      averagingMin: SIX_MIN,
    },
    { from: 2000, to: 6000, label: '>2–6 GHz', E: null, H: null, S: k(200), averagingMin: SIX_MIN, notes: [NA_2020] },
    ...lastRows(
      fn((f) => 275 / (f / 1000) ** 0.177, '275/f_G^0.177'),
      100,
    ),
  ]),
};
const icnirp2020LocalGeneral: LimitTable = {
  source: 'ICNIRP 2020 (Health Phys. 118(5):483–524) Table 6, local reference levels, general public, 6 min',
  status: 'C',
  rows: rows([
    { from: 0.1, to: 30, label: '0.1–30 MHz', E: fn((f) => 671 / f ** 0.7, '671/f_M^0.7'), H: fn((f) => 4.9 / f, '4.9/f_M'), S: null, averagingMin: SIX_MIN, notes: [NA_2020] },
    { from: 30, to: 400, label: '>30–400 MHz', E: k(62), H: k(0.163), S: k(10), averagingMin: SIX_MIN },
    {
      from: 400,
      to: 2000,
      label: '>400–2000 MHz',
      E: fn((f) => 4.72 * f ** 0.43, '4.72 f_M^0.43'),
      H: fn((f) => 0.0123 * f ** 0.43, '0.0123 f_M^0.43'),
      S: fn((f) => 0.058 * f ** 0.86, '0.058 f_M^0.86'),
      averagingMin: SIX_MIN,
    },
    { from: 2000, to: 6000, label: '>2–6 GHz', E: null, H: null, S: k(40), averagingMin: SIX_MIN, notes: [NA_2020] },
    ...lastRows(
      fn((f) => 55 / (f / 1000) ** 0.177, '55/f_G^0.177'),
      20,
    ),
  ]),
};

// RSS-102 Issue 5 Tables 4/5 (= Safety Code 6 (2015) Tables 5/6), RSS-102 Issue 5 Tables 4–5, from memory.
// Averaging: 6 min up to 15 GHz, 616000/f^1.2 min above (f in MHz).
const isedAveraging = fn((f) => (f <= 15_000 ? 6 : 616_000 / f ** 1.2), '6 (f ≤ 15 GHz); 616000/f^1.2 (f > 15 GHz)');
const NO_S_ISED = 'RSS-102 gives no power-density reference level below 10 MHz.';
const isedGeneral: LimitTable = {
  source: 'RSS-102 Issue 5 Table 4, reference levels for the general public (uncontrolled environment) = Safety Code 6 (2015) Table 5',
  status: 'M (from memory)',
  rows: rows([
    {
      from: 0.1,
      to: 1.1,
      label: '0.1–10 MHz (H); E (SAR basis) only from 1.1 MHz',
      E: null,
      H: fn((f) => 0.73 / f, '0.73/f'),
      S: null,
      averagingMin: isedAveraging,
      notes: [NO_S_ISED, 'No SAR-basis E-field reference level below 1.1 MHz; only the instantaneous nerve-stimulation limit applies (additionalLimits).'],
    },
    { from: 1.1, to: 10, label: '1.1–10 MHz', E: fn((f) => 87 / f ** 0.5, '87/f^0.5'), H: fn((f) => 0.73 / f, '0.73/f'), S: null, averagingMin: isedAveraging, notes: [NO_S_ISED] },
    { from: 10, to: 20, label: '10–20 MHz', E: k(27.46), H: k(0.0728), S: k(2), averagingMin: isedAveraging },
    {
      from: 20,
      to: 48,
      label: '20–48 MHz',
      E: fn((f) => 58.07 / f ** 0.25, '58.07/f^0.25'),
      H: fn((f) => 0.154 / f ** 0.25, '0.1540/f^0.25'),
      S: fn((f) => 8.944 / f ** 0.5, '8.944/f^0.5'),
      averagingMin: isedAveraging,
    },
    { from: 48, to: 300, label: '48–300 MHz', E: k(22.06), H: k(0.05852), S: k(1.291), averagingMin: isedAveraging },
    {
      from: 300,
      to: 6000,
      label: '300–6000 MHz',
      E: fn((f) => 3.142 * f ** 0.3417, '3.142 f^0.3417'),
      H: fn((f) => 0.008335 * f ** 0.3417, '0.008335 f^0.3417'),
      S: fn((f) => 0.02619 * f ** 0.6834, '0.02619 f^0.6834'),
      averagingMin: isedAveraging,
    },
    { from: 6000, to: 15_000, label: '6000–15000 MHz', E: k(61.4), H: k(0.163), S: k(10), averagingMin: isedAveraging },
    { from: 15_000, to: 150_000, label: '15000–150000 MHz', E: k(61.4), H: k(0.163), S: k(10), averagingMin: isedAveraging },
    {
      from: 150_000,
      to: 300_000,
      label: '150000–300000 MHz',
      E: fn((f) => 0.158 * f ** 0.5, '0.158 f^0.5'),
      H: fn((f) => 4.21e-4 * f ** 0.5, '4.21×10⁻⁴ f^0.5'),
      S: fn((f) => 6.67e-5 * f, '6.67×10⁻⁵ f'),
      averagingMin: isedAveraging,
    },
  ]),
  additional: (f) => (f <= 10 ? [{ basis: 'nerve stimulation (RSS-102 Table 4, 0.003–10 MHz)', electricFieldVPerM: 83, magneticFieldAPerM: 90, averaging: 'instantaneous' }] : []),
};
const isedControlled: LimitTable = {
  source: 'RSS-102 Issue 5 Table 5, reference levels for the controlled environment = Safety Code 6 (2015) Table 6',
  status: 'M (from memory)',
  rows: rows([
    {
      from: 0.1,
      to: 1.29,
      label: '0.1–10 MHz (H); E (SAR basis) only from 1.29 MHz',
      E: null,
      H: fn((f) => 1.6 / f, '1.6/f'),
      S: null,
      averagingMin: isedAveraging,
      notes: [NO_S_ISED, 'No SAR-basis E-field reference level below 1.29 MHz; only the instantaneous nerve-stimulation limit applies (additionalLimits).'],
    },
    { from: 1.29, to: 10, label: '1.29–10 MHz', E: fn((f) => 193 / f ** 0.5, '193/f^0.5'), H: fn((f) => 1.6 / f, '1.6/f'), S: null, averagingMin: isedAveraging, notes: [NO_S_ISED] },
    { from: 10, to: 20, label: '10–20 MHz', E: k(61.4), H: k(0.163), S: k(10), averagingMin: isedAveraging },
    {
      from: 20,
      to: 48,
      label: '20–48 MHz',
      E: fn((f) => 129.8 / f ** 0.25, '129.8/f^0.25'),
      H: fn((f) => 0.3444 / f ** 0.25, '0.3444/f^0.25'),
      S: fn((f) => 44.72 / f ** 0.5, '44.72/f^0.5'),
      averagingMin: isedAveraging,
    },
    { from: 48, to: 100, label: '48–100 MHz', E: k(49.33), H: k(0.1309), S: k(6.455), averagingMin: isedAveraging },
    {
      from: 100,
      to: 6000,
      label: '100–6000 MHz',
      E: fn((f) => 15.6 * f ** 0.25, '15.60 f^0.25'),
      H: fn((f) => 0.04138 * f ** 0.25, '0.04138 f^0.25'),
      S: fn((f) => 0.6455 * f ** 0.5, '0.6455 f^0.5'),
      averagingMin: isedAveraging,
    },
    { from: 6000, to: 15_000, label: '6000–15000 MHz', E: k(137), H: k(0.364), S: k(50), averagingMin: isedAveraging },
    { from: 15_000, to: 150_000, label: '15000–150000 MHz', E: k(137), H: k(0.364), S: k(50), averagingMin: isedAveraging },
    {
      from: 150_000,
      to: 300_000,
      label: '150000–300000 MHz',
      E: fn((f) => 0.354 * f ** 0.5, '0.354 f^0.5'),
      H: fn((f) => 9.4e-4 * f ** 0.5, '9.40×10⁻⁴ f^0.5'),
      S: fn((f) => 3.33e-4 * f, '3.33×10⁻⁴ f'),
      averagingMin: isedAveraging,
    },
  ]),
  additional: (f) => (f <= 10 ? [{ basis: 'nerve stimulation (RSS-102 Table 5, 0.003–10 MHz)', electricFieldVPerM: 170, magneticFieldAPerM: 180, averaging: 'instantaneous' }] : []),
};

function tableFor(regime: ExposureRegime, tier: Tier, exposure: ExposureKind): LimitTable {
  if (exposure === 'local' && regime !== 'icnirp-2020') {
    throw new CalcRangeError(`exposure "local" is only tabulated for icnirp-2020 (ICNIRP 2020 Table 6); ${regime} has whole-body limits only.`, [
      { path: ['exposure'], message: 'local reference levels exist only for icnirp-2020' },
    ]);
  }
  const general = tier === 'general';
  switch (regime) {
    case 'fcc':
      return general ? fccGeneral : fccOccupational;
    case 'ised':
      return general ? isedGeneral : isedControlled;
    case 'icnirp-1998':
      return general ? icnirp1998General : icnirp1998Occupational;
    case 'icnirp-2020':
      if (exposure === 'local') return general ? icnirp2020LocalGeneral : icnirp2020LocalOccupational;
      return general ? icnirp2020WholeBodyGeneral : icnirp2020WholeBodyOccupational;
  }
}

/** The table's full frequency range, Hz. */
export function exposureLimitRangeHz(regime: ExposureRegime, tier: Tier, exposure: ExposureKind = 'whole-body') {
  const t = tableFor(regime, tier, exposure).rows;
  return { minHz: t[0].interval.min * 1e6, maxHz: t[t.length - 1].interval.max * 1e6 };
}

/** Breakpoints per table, computed once (the screening asks for them at every far-field combination). */
const breakpointsByTable = new Map<LimitTable, readonly number[]>();

/** Row edges and averaging-time changes inside the table, Hz (for a band's most restrictive frequency). */
export function exposureLimitBreakpointsHz(regime: ExposureRegime, tier: Tier, exposure: ExposureKind = 'whole-body'): readonly number[] {
  const table = tableFor(regime, tier, exposure);
  let breakpoints = breakpointsByTable.get(table);
  if (!breakpoints) {
    const edges = [...table.rows.slice(0, -1).map((r) => r.interval.max), ...(table.averagingBreakpointsMHz ?? [])];
    breakpoints = Object.freeze([...new Set(edges)].sort((a, b) => a - b).map((f) => f * 1e6));
    breakpointsByTable.set(table, breakpoints);
  }
  return breakpoints;
}

export interface ExposureLimit {
  powerDensityWPerM2: number | null;
  electricFieldVPerM: number | null;
  magneticFieldAPerM: number | null;
  averagingTimeS: number;
  source: string;
  /** The row used, as the source labels it. */
  row: string;
  additionalLimits: AdditionalLimit[];
}

function lookup(frequencyHz: number, regime: ExposureRegime, tier: Tier, exposure: ExposureKind) {
  const table = tableFor(regime, tier, exposure);
  const fMHz = frequencyHz / 1e6;
  const row = rowAt(table, fMHz);
  if (!row) {
    const { minHz, maxHz } = exposureLimitRangeHz(regime, tier, exposure);
    const message = `frequencyHz = ${formatHz(frequencyHz)} is outside ${table.source}: it is tabulated from ${formatHz(minHz)} to ${formatHz(maxHz)}.`;
    throw new CalcRangeError(message, [{ path: ['frequencyHz'], message }]);
  }
  return { table, row, fMHz };
}

/** The first row whose interval holds fMHz. */
function rowAt(table: LimitTable, fMHz: number): Row | undefined {
  for (const r of table.rows) if (inInterval(fMHz, r.interval)) return r;
  return undefined;
}

function limitAt(table: LimitTable, row: Row, fMHz: number): ExposureLimit {
  return {
    powerDensityWPerM2: row.S ? row.S.at(fMHz) : null,
    electricFieldVPerM: row.E ? row.E.at(fMHz) : null,
    magneticFieldAPerM: row.H ? row.H.at(fMHz) : null,
    averagingTimeS: row.averagingMin.at(fMHz) * 60,
    source: table.source,
    row: row.label,
    additionalLimits: table.additional ? table.additional(fMHz) : [],
  };
}

/**
 * Exposure limit (MPE / reference level) at one frequency.
 * @param frequencyHz frequency, Hz
 * @returns power density W/m², E V/m rms, H A/m rms (null where the table has no value), averaging time s
 * @throws CalcRangeError outside the table's frequency range
 */
export function exposureLimit(frequencyHz: number, regime: ExposureRegime, tier: Tier, exposure: ExposureKind = 'whole-body'): ExposureLimit {
  const { table, row, fMHz } = lookup(frequencyHz, regime, tier, exposure);
  return limitAt(table, row, fMHz);
}

/** The power-density limit alone, W/m² (null where the row has none): the screening's band search asks for it per candidate. */
export function exposureLimitPowerDensityWPerM2(frequencyHz: number, regime: ExposureRegime, tier: Tier, exposure: ExposureKind = 'whole-body'): number | null {
  const { row, fMHz } = lookup(frequencyHz, regime, tier, exposure);
  return row.S ? row.S.at(fMHz) : null;
}

export const exposureLimitInput = z.object({
  frequencyHz: z.number().positive().describe('Frequency, Hz'),
  regime: z.enum(exposureRegimes),
  tier: z.enum(tiers),
  exposure: z.enum(exposureKinds).default('whole-body').describe('ICNIRP 2020 only: whole-body (Table 5) or local (Table 6)'),
});

const cellText = (c: Cell | null) => (c ? c.text : 'no value');

/** The text of a row's derivation that depends on the row alone, built once per row. */
const rowTextCache = new Map<Row, { formula: string; missingNote: string | null }>();
function rowText(row: Row) {
  let text = rowTextCache.get(row);
  if (!text) {
    const missing = (['E', 'H', 'S'] as const).filter((key) => row[key] === null);
    text = {
      formula: `Row ${row.label}: E = ${cellText(row.E)} V/m; H = ${cellText(row.H)} A/m; S = ${cellText(row.S)}${row.S && !row.S.text.includes('mW') ? ' W/m²' : ''}; averaging ${row.averagingMin.text} min (f in MHz unless marked f_G)`,
      missingNote: missing.length ? `No value in the table for ${missing.join(', ')} in ${row.label}: returned as null.` : null,
    };
    rowTextCache.set(row, text);
  }
  return text;
}

export function computeExposureLimit(input: z.output<typeof exposureLimitInput>): ExposureLimit & { derivation: Derivation } {
  const { frequencyHz, regime, tier, exposure } = input;
  const { table, row, fMHz } = lookup(frequencyHz, regime, tier, exposure);
  const limit = limitAt(table, row, fMHz);
  const text = rowText(row);
  const notes = [`A row "a–b" is taken as a < f ≤ b (the first row includes a); at a shared edge the lower row applies.`, `Reference status of these values: ${table.status}.`];
  if (text.missingNote) notes.push(text.missingNote);
  if (row.notes) for (const n of row.notes) notes.push(n);
  if (limit.powerDensityWPerM2 !== null && limit.electricFieldVPerM === null) {
    notes.push(`Plane-wave equivalent E = √(377·S) = ${Math.sqrt(377 * limit.powerDensityWPerM2).toFixed(1)} V/m (free-space plane-wave conversion, Z0 ≈ 377 Ω; not a tabulated limit).`);
  }
  if (limit.additionalLimits.length) notes.push('additionalLimits lists limits that apply in addition at this frequency.');
  return {
    powerDensityWPerM2: limit.powerDensityWPerM2,
    electricFieldVPerM: limit.electricFieldVPerM,
    magneticFieldAPerM: limit.magneticFieldAPerM,
    averagingTimeS: limit.averagingTimeS,
    source: limit.source,
    row: limit.row,
    additionalLimits: limit.additionalLimits,
    derivation: {
      formula: text.formula,
      inputs: {
        frequencyHz: q(frequencyHz, 'Hz'),
        regime: q(regime, '1'),
        tier: q(tier, '1'),
        exposure: q(exposure, '1'),
      },
      intermediate: { fMHz: q(fMHz, 'MHz'), averagingTimeMin: q(limit.averagingTimeS / 60, 'min') },
      result: {
        powerDensityWPerM2: q(limit.powerDensityWPerM2, 'W/m²'),
        electricFieldVPerM: q(limit.electricFieldVPerM, 'V/m'),
        magneticFieldAPerM: q(limit.magneticFieldAPerM, 'A/m'),
        averagingTimeS: q(limit.averagingTimeS, 's'),
      },
      source: `${table.source}, row ${row.label}`,
      notes,
    },
  };
}

export const exposureLimitCalculation = defineCalculation({
  name: 'exposure-limit',
  title: 'Exposure limit (MPE / reference level)',
  description: 'Power density, E and H limits and averaging time at a frequency, for FCC, ISED, ICNIRP 1998 or ICNIRP 2020 (whole-body or local), general or occupational tier.',
  input: exposureLimitInput,
  compute: computeExposureLimit,
  sources: [
    fccGeneral.source,
    fccOccupational.source,
    isedGeneral.source,
    isedControlled.source,
    icnirp1998General.source,
    icnirp1998Occupational.source,
    icnirp2020WholeBodyGeneral.source,
    icnirp2020LocalGeneral.source,
  ],
});
