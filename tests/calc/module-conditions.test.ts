/**
 * A certified module's grant conditions in a host's screening: the grant's minimum separation
 * binds the host (FCC KDB 996369 D01/D03, from memory). Cases are hand-made: a module grant of
 * 15 mm against positions at 10 mm (warned), 15 mm (at the limit, not warned) and none given.
 */
import { describe, expect, it } from 'vitest';
import { moduleConditionWarnings, screenDevice } from '../../calc/screening';

const input = {
  markets: [{ regime: 'fcc' as const, tier: 'general' as const }],
  antennas: [
    { id: 'A', gainDbi: 0 },
    { id: 'B', gainDbi: 0 },
  ],
  transmitters: [
    { id: 'MOD-LTE', frequencyMinHz: 1850e6, frequencyMaxHz: 1910e6, maxTuneUpPowerDbm: 23, dutyCycle: 1, antennaId: 'A', moduleId: 'M1' },
    { id: 'HOST-BT', frequencyMinHz: 2402e6, frequencyMaxHz: 2480e6, maxTuneUpPowerDbm: 4, dutyCycle: 1, antennaId: 'B' },
  ],
  usePositions: [
    {
      id: 'body',
      kind: 'body-worn' as const,
      separations: [
        { antennaId: 'A', separationM: 0.01 },
        { antennaId: 'B', separationM: 0 },
      ],
    },
    {
      id: 'desk',
      kind: 'body-worn' as const,
      separations: [
        { antennaId: 'A', separationM: 0.015 },
        { antennaId: 'B', separationM: 0 },
      ],
    },
  ],
  modules: [{ id: 'M1', minSeparationM: 0.015 }],
};

describe('module grant conditions', () => {
  it('warns only where a module transmitter’s antenna is closer than the grant’s minimum', () => {
    const w = moduleConditionWarnings(input as never);
    expect(w.map((x) => [x.transmitterId, x.usePositionId, x.antennaId, x.separationM, x.minSeparationM])).toEqual([['MOD-LTE', 'body', 'A', 0.01, 0.015]]);
    expect(w[0].source).toMatch(/KDB 996369/);
  });

  it('the screening output lists them and notes them in the rows they concern', () => {
    const out = screenDevice(input);
    expect(out.conditions).toHaveLength(1);
    const notes = (tx: string, pos: string) => out.rows.find((r) => r.transmitterId === tx && r.usePositionId === pos)!.derivation.notes.join(' ');
    expect(notes('MOD-LTE', 'body')).toMatch(/Module grant condition: .*10 mm, closer than the 15 mm module M1/);
    expect(notes('MOD-LTE', 'desk')).not.toMatch(/Module grant condition/);
    expect(notes('HOST-BT', 'body')).not.toMatch(/Module grant condition/);
  });

  it('a module without a stated minimum, or no modules at all, warns of nothing', () => {
    expect(screenDevice({ ...input, modules: [{ id: 'M1' }] }).conditions).toEqual([]);
    expect(screenDevice({ ...input, modules: undefined, transmitters: input.transmitters.map(({ moduleId: _m, ...t }) => t) }).conditions).toEqual([]);
  });

  it('a transmitter naming an unknown module is refused', () => {
    expect(() => screenDevice({ ...input, modules: [] })).toThrow(/unknown module id/);
  });
});
