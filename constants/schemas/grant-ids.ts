/**
 * The identifiers a grant is filed under, with the formats their regulators publish.
 *
 * - FCC ID = grantee code + equipment product code (47 CFR §2.926(a)).
 *   Grantee code: §2.926(c) leaves its format to the FCC's Office of Engineering and Technology;
 *   OET's "Equipment Authorization – Grantee Code" page (see KDB 204515): a code that begins with a
 *   letter (A–Z) has three characters, one that begins with a digit (2–9) has five (five-character
 *   codes since May 2013, Public Notice DA 13-669), and the digits 0 and 1 are not used.
 *   Product code: §2.926(d): capital letters, digits and the dash, at most 14 in total; the same
 *   OET page adds that consecutive dashes are not permitted (a dash stands between two
 *   alphanumerics).
 * - ISED certification number "IC: CN-UPN" (ISED RSP-100, certification number format
 *   XXXXXX-YYYYYYYYYYY): the company number (CN) assigned by ISED, up to 6 alphanumerics, and the
 *   unique product number (UPN) the applicant chooses, up to 11 alphanumerics. The clause number
 *   in RSP-100 is from memory. HVIN, PMN and FVIN are RSP-100's hardware version identification
 *   number, product marketing name and firmware version identification number.
 *
 * Letters are taken in either case and stored as capitals (the rules print capitals).
 */
import { z } from 'zod';

export const GRANTEE_CODE_PATTERN = /^(?:[A-Z][A-Z2-9]{2}|[2-9][A-Z2-9]{4})$/;
export const PRODUCT_CODE_MAX = 14;
export const PRODUCT_CODE_PATTERN = /^[A-Z0-9]+(?:-[A-Z0-9]+)*$/;
export const ISED_CN_MAX = 6;
export const ISED_CN_PATTERN = /^[A-Z0-9]{1,6}$/;
export const ISED_UPN_MAX = 11;
export const ISED_UPN_PATTERN = /^[A-Z0-9]{1,11}$/;

export const FCC_ID_SOURCE = '47 CFR §2.926; FCC OET grantee-code format (KDB 204515)';
export const ISED_NUMBER_SOURCE = 'ISED RSP-100 (certification number CN-UPN; clause from memory)';

/** Why a typed grantee code is not one, in words (null when it is one). */
export function granteeCodeProblem(code: string): string | null {
  if (GRANTEE_CODE_PATTERN.test(code)) return null;
  if (/[^A-Z0-9]/.test(code)) return 'A grantee code has only letters and digits (47 CFR §2.926).';
  if (/[01]/.test(code)) return 'A grantee code never uses the digits 0 or 1 (FCC grantee-code format).';
  if (/^[A-Z]/.test(code)) return `A grantee code that starts with a letter has 3 characters; this one has ${code.length}.`;
  if (/^[2-9]/.test(code)) return `A grantee code that starts with a digit has 5 characters; this one has ${code.length}.`;
  return 'A grantee code starts with a letter (3 characters) or a digit 2–9 (5 characters).';
}

export function productCodeProblem(code: string): string | null {
  if (code.length > PRODUCT_CODE_MAX) return `A product code has at most ${PRODUCT_CODE_MAX} characters, dashes included (47 CFR §2.926(d)); this one has ${code.length}.`;
  if (/[^A-Z0-9-]/.test(code)) return 'A product code has only letters, digits and dashes (47 CFR §2.926(d)).';
  if (!PRODUCT_CODE_PATTERN.test(code)) return 'A dash in a product code stands between two letters or digits (no leading, trailing or double dash).';
  return null;
}

export function isedCompanyNumberProblem(cn: string): string | null {
  if (ISED_CN_PATTERN.test(cn)) return null;
  return cn.length > ISED_CN_MAX ? `An ISED company number has at most ${ISED_CN_MAX} characters; this one has ${cn.length}.` : 'An ISED company number has only letters and digits.';
}

export function isedUpnProblem(upn: string): string | null {
  if (ISED_UPN_PATTERN.test(upn)) return null;
  return upn.length > ISED_UPN_MAX ? `A unique product number (UPN) has at most ${ISED_UPN_MAX} characters; this one has ${upn.length}.` : 'A unique product number (UPN) has only letters and digits.';
}

/** A code field: trimmed, capitals, '' when not stated; `problem` says what is wrong with a stated one. */
const codeField = (problem: (v: string) => string | null, description: string) =>
  z
    .string()
    .trim()
    .toUpperCase()
    .default('')
    .superRefine((v, ctx) => {
      const p = v ? problem(v) : null;
      if (p) ctx.addIssue({ code: 'custom', message: p });
    })
    .describe(description);

export const zGranteeCode = codeField(granteeCodeProblem, 'FCC grantee code (47 CFR §2.926(c)): 3 characters starting with a letter, or 5 starting with a digit 2–9; "" when not stated.');
export const zProductCode = codeField(productCodeProblem, 'FCC equipment product code (47 CFR §2.926(d)): up to 14 capital letters, digits and dashes; "" when not stated.');
export const zIsedCompanyNumber = codeField(isedCompanyNumberProblem, 'ISED company number (CN), up to 6 letters and digits (RSP-100); "" when not stated.');
export const zIsedUpn = codeField(isedUpnProblem, 'ISED unique product number (UPN), up to 11 letters and digits (RSP-100); "" when not stated.');

/** The two halves of an identifier go together: one without the other is flagged on the empty one. */
export function pairIssues(v: { fccGranteeCode: string; fccProductCode: string; isedCompanyNumber: string; isedUpn: string }, ctx: z.RefinementCtx, at: (string | number)[] = []) {
  if (v.fccGranteeCode && !v.fccProductCode) ctx.addIssue({ code: 'custom', path: [...at, 'fccProductCode'], message: 'Enter the product code that goes with the grantee code.' });
  if (!v.fccGranteeCode && v.fccProductCode) ctx.addIssue({ code: 'custom', path: [...at, 'fccGranteeCode'], message: 'Enter the grantee code that goes with the product code.' });
  if (v.isedCompanyNumber && !v.isedUpn) ctx.addIssue({ code: 'custom', path: [...at, 'isedUpn'], message: 'Enter the UPN that goes with the company number.' });
  if (!v.isedCompanyNumber && v.isedUpn) ctx.addIssue({ code: 'custom', path: [...at, 'isedCompanyNumber'], message: 'Enter the company number that goes with the UPN.' });
}

/** The identifier as a label prints it (FCC ID: grantee and product code run together; IC: CN-UPN); '' when not stated. */
export const fccIdText = (grantee: string, product: string) => (grantee && product ? `${grantee}${product}` : '');
export const isedNumberText = (cn: string, upn: string) => (cn && upn ? `${cn}-${upn}` : '');
