/**
 * Conditions of a certified module's grant that bind the host it is built into: here the grant's
 * minimum separation between the module's antenna and the body. Where a host's use position
 * brings an antenna of a module transmitter closer than that, the module's own RF-exposure
 * evaluation does not cover the use, and the host needs an evaluation of its own (a permissive
 * change or a new grant). Source: FCC KDB 996369 D01/D03 (modular approval; the host follows the
 * RF-exposure conditions of the module's grant) — from memory; the certifying body decides.
 */
import { antennasOf, type ScreeningInput } from './input';

export const MODULE_CONDITION_SOURCE = 'FCC KDB 996369 D01/D03, module grant conditions bind the host (from memory)';

export interface ModuleConditionWarning {
  code: 'module-min-separation';
  moduleId: string;
  transmitterId: string;
  usePositionId: string;
  antennaId: string;
  /** The use position's separation, m. */
  separationM: number;
  /** The module grant's minimum separation, m. */
  minSeparationM: number;
  message: string;
  source: string;
}

const mm = (m: number) => `${Number((m * 1000).toFixed(1))} mm`;

/** Every transmitter × use position × antenna closer to the body than its module's grant allows. */
export function moduleConditionWarnings(input: Pick<ScreeningInput, 'transmitters' | 'usePositions' | 'modules'>): ModuleConditionWarning[] {
  const modules = new Map((input.modules ?? []).map((m) => [m.id, m]));
  const out: ModuleConditionWarning[] = [];
  for (const tx of input.transmitters) {
    const mod = tx.moduleId !== undefined ? modules.get(tx.moduleId) : undefined;
    if (!mod || mod.minSeparationM === undefined) continue;
    for (const position of input.usePositions) {
      for (const antennaId of antennasOf(tx)) {
        const sep = position.separations.find((s) => s.antennaId === antennaId);
        if (!sep || sep.separationM >= mod.minSeparationM) continue;
        out.push({
          code: 'module-min-separation',
          moduleId: mod.id,
          transmitterId: tx.id,
          usePositionId: position.id,
          antennaId,
          separationM: sep.separationM,
          minSeparationM: mod.minSeparationM,
          message: `“${position.id}” puts antenna ${antennaId} of ${tx.id} at ${mm(sep.separationM)}, closer than the ${mm(mod.minSeparationM)} module ${mod.id}’s grant allows: the module’s RF-exposure evaluation does not cover this use, so the host needs its own (the certifying body decides).`,
          source: MODULE_CONDITION_SOURCE,
        });
      }
    }
  }
  return out;
}
