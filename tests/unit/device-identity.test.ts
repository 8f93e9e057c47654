/**
 * Grant identifiers against their published formats, and the duty-factor presets against the
 * tables they cite.
 * - FCC ID: 47 CFR §2.926(c)/(d) and the FCC OET "Equipment Authorization – Grantee Code" page
 *   (KDB 204515): grantee codes that start with a letter have 3 characters, those that start with
 *   a digit 2–9 have 5, the digits 0 and 1 are not used; product codes have at most 14 capital
 *   letters, digits and dashes, no two dashes in a row.
 * - ISED: RSP-100 certification number CN-UPN, CN up to 6 and UPN up to 11 alphanumerics (clause
 *   from memory).
 * - LTE TDD: 3GPP TS 36.211 Table 4.2-2 (uplink-downlink configurations) and Table 4.2-1 (UpPTS
 *   up to 5120·Ts of a 30720·Ts subframe).
 */
import { describe, expect, it } from 'vitest';
import { DUTY_FACTOR_PRESETS, findDutyFactorPreset, LTE_TDD_CONFIGURATIONS, tddUplinkShare } from '../../constants/duty-factors';
import { zDeviceInfo, zTransmitter } from '../../constants/schemas/device-file';
import { granteeCodeProblem, isedCompanyNumberProblem, isedUpnProblem, productCodeProblem } from '../../constants/schemas/grant-ids';

const device = { name: 'Test', model: 'T-1', applicant: 'Halden Ridge Instruments', productType: 'phone' };
const issues = (value: unknown) => {
  const r = zDeviceInfo.safeParse(value);
  return r.success ? {} : Object.fromEntries(r.error.issues.map((i) => [i.path.join('.'), i.message]));
};

describe('FCC ID (47 CFR §2.926, OET grantee-code format)', () => {
  it('takes 3-character codes that start with a letter and 5-character codes that start with 2–9', () => {
    for (const code of ['BCG', 'A3K', '2BHRW', '9ZZ22']) expect(granteeCodeProblem(code), code).toBeNull();
  });

  it('refuses other lengths, the digits 0 and 1, a leading 0/1 and other characters, each in words', () => {
    expect(granteeCodeProblem('HRIX')).toMatch(/starts with a letter has 3 characters; this one has 4/);
    expect(granteeCodeProblem('2BHR')).toMatch(/starts with a digit has 5 characters; this one has 4/);
    expect(granteeCodeProblem('2B0RW')).toMatch(/never uses the digits 0 or 1/);
    expect(granteeCodeProblem('1ABCD')).toMatch(/never uses the digits 0 or 1/);
    expect(granteeCodeProblem('AB-')).toMatch(/only letters and digits/);
  });

  it('product codes: up to 14 characters of capitals, digits and single dashes (§2.926(d))', () => {
    expect(productCodeProblem('TH4LW2')).toBeNull();
    expect(productCodeProblem('A-B-C-D-E-F-G8')).toBeNull(); // 14 characters, dashes included
    expect(productCodeProblem('ABCDEFGHIJKLMNO')).toMatch(/at most 14 characters/);
    expect(productCodeProblem('AB--C')).toMatch(/no leading, trailing or double dash/);
    expect(productCodeProblem('-AB')).toMatch(/no leading, trailing or double dash/);
    expect(productCodeProblem('AB_C')).toMatch(/letters, digits and dashes/);
  });

  it('stores capitals and asks for both halves of the identifier', () => {
    const ok = zDeviceInfo.parse({ ...device, fccGranteeCode: '2bhrw', fccProductCode: 'th4lw2' });
    expect([ok.fccGranteeCode, ok.fccProductCode]).toEqual(['2BHRW', 'TH4LW2']);
    expect(issues({ ...device, fccGranteeCode: '2BHRW' })).toEqual({ fccProductCode: 'Enter the product code that goes with the grantee code.' });
    expect(issues({ ...device, isedUpn: 'TH4LW2' })).toEqual({ isedCompanyNumber: 'Enter the company number that goes with the UPN.' });
  });
});

describe('ISED certification number (RSP-100 CN-UPN)', () => {
  it('company number up to 6 and UPN up to 11 letters and digits', () => {
    expect(isedCompanyNumberProblem('27861H')).toBeNull();
    expect(isedCompanyNumberProblem('1234567')).toMatch(/at most 6 characters/);
    expect(isedUpnProblem('TH4LW2')).toBeNull();
    expect(isedUpnProblem('ABCDEFGHIJKL')).toMatch(/at most 11 characters/);
    expect(isedUpnProblem('TH4-LW2')).toMatch(/only letters and digits/);
  });
});

describe('device identity', () => {
  it('older identities (no grant fields) still parse, as a host with nothing stated', () => {
    expect(zDeviceInfo.parse(device)).toMatchObject({ fccGranteeCode: '', isedUpn: '', hvin: '', modelVariants: [], integration: 'host', modules: [] });
  });

  it('module grants belong to a host with a module inside, each with an FCC ID or ISED number', () => {
    const module = { id: 'LTE-MOD', fccGranteeCode: 'XMR', fccProductCode: 'KM7', minSeparationM: 0.02 };
    expect(issues({ ...device, integration: 'host-with-module', modules: [module] })).toEqual({});
    expect(issues({ ...device, modules: [module] })).toMatchObject({ integration: expect.stringMatching(/host with a certified module inside/) });
    expect(issues({ ...device, integration: 'host-with-module', modules: [{ id: 'M' }] })).toMatchObject({ 'modules.0.fccGranteeCode': expect.stringMatching(/FCC ID or its ISED/) });
    expect(issues({ ...device, integration: 'host-with-module', modules: [module, module] })).toMatchObject({ 'modules.1.id': 'Duplicate id "LTE-MOD".' });
  });

  it('a model variant is not the tested model again', () => {
    expect(issues({ ...device, modelVariants: [{ model: 't-1' }] })).toMatchObject({ 'modelVariants.0.model': 'Model "t-1" is already listed.' });
  });
});

describe('tune-up power as target ± tolerance', () => {
  const tx = { id: 'TX', technology: 'LTE', band: 'Band 2', frequencyMinHz: 1850e6, frequencyMaxHz: 1910e6, antennaId: 'A' };
  it('the maximum is the upper bound, target + tolerance', () => {
    expect(zTransmitter.safeParse({ ...tx, maxTuneUpPowerDbm: 23.5, tuneUpTargetDbm: 22.5, tuneUpToleranceDb: 1 }).success).toBe(true);
    const bad = zTransmitter.safeParse({ ...tx, maxTuneUpPowerDbm: 23, tuneUpTargetDbm: 22.5, tuneUpToleranceDb: 1 });
    expect(bad.error?.issues[0]).toMatchObject({ path: ['maxTuneUpPowerDbm'], message: expect.stringMatching(/gives 23\.5 dBm/) });
    const half = zTransmitter.safeParse({ ...tx, maxTuneUpPowerDbm: 23, tuneUpTargetDbm: 22 });
    expect(half.error?.issues[0].path).toEqual(['tuneUpToleranceDb']);
  });

  it('a duty-factor preset fixes the duty cycle it names', () => {
    expect(zTransmitter.safeParse({ ...tx, maxTuneUpPowerDbm: 23, dutyCycle: 0.5, dutyCyclePreset: 'ptt-50' }).success).toBe(true);
    const off = zTransmitter.safeParse({ ...tx, maxTuneUpPowerDbm: 23, dutyCycle: 0.6, dutyCyclePreset: 'ptt-50' });
    expect(off.error?.issues[0]).toMatchObject({ path: ['dutyCycle'], message: expect.stringMatching(/gives 50 %/) });
    expect(zTransmitter.safeParse({ ...tx, maxTuneUpPowerDbm: 23, dutyCyclePreset: 'lte-tdd-9' }).success).toBe(false);
  });
});

describe('duty-factor presets', () => {
  it('LTE TDD configurations as printed in 3GPP TS 36.211 Table 4.2-2', () => {
    // Table 4.2-2: configuration 0 D S U U U D S U U U; 1 D S U U D D S U U D; 5 D S U D D D D D D D.
    expect(LTE_TDD_CONFIGURATIONS[0]).toBe('DSUUUDSUUU');
    expect(LTE_TDD_CONFIGURATIONS[1]).toBe('DSUUDDSUUD');
    expect(LTE_TDD_CONFIGURATIONS[5]).toBe('DSUDDDDDDD');
    expect(Object.keys(LTE_TDD_CONFIGURATIONS)).toHaveLength(7);
  });

  it('uplink share counts U subframes whole and each S subframe’s UpPTS at 5120·Ts (hand-computed)', () => {
    // Configuration 0: (6 × 30720 + 2 × 5120) / 307200 = 194560 / 307200 = 0.63333…
    expect(tddUplinkShare(LTE_TDD_CONFIGURATIONS[0])).toBeCloseTo(0.633333, 6);
    // Configuration 5: (1 × 30720 + 1 × 5120) / 307200 = 0.116666…
    expect(tddUplinkShare(LTE_TDD_CONFIGURATIONS[5])).toBeCloseTo(0.116667, 6);
    // Stored rounded up to 0.01 %, never below the share.
    expect(findDutyFactorPreset('lte-tdd-0')!.dutyCycle).toBe(0.6334);
    for (const p of DUTY_FACTOR_PRESETS.filter((x) => x.key.startsWith('lte-tdd'))) {
      expect(p.dutyCycle).toBeGreaterThanOrEqual(tddUplinkShare(LTE_TDD_CONFIGURATIONS[Number(p.key.slice(8))]));
    }
  });

  it('push-to-talk 50 % (common practice) and GSM slots of 8 (3GPP TS 45.002), each naming its source', () => {
    expect(findDutyFactorPreset('ptt-50')).toMatchObject({ dutyCycle: 0.5, source: expect.stringMatching(/Common practice/) });
    expect(findDutyFactorPreset('gsm-2-slot')).toMatchObject({ dutyCycle: 0.25, source: expect.stringMatching(/TS 45\.002/) });
    for (const p of DUTY_FACTOR_PRESETS) expect(p.source.length, p.key).toBeGreaterThan(5);
  });
});
