/**
 * Planar tissue stacks for the SAR-against-depth estimate, one per use-position kind, from the
 * surface inwards. Dielectric properties come from the Gabriel 1996 Cole-Cole model and densities
 * from the IT'IS database (calc/em/tissue-properties.ts); these stacks only choose the tissues and
 * their thicknesses.
 *
 * Thicknesses are typical adult values — common practice, from memory, no single published
 * source. They are meant to show how power divides between layers, not to model a person: real
 * skin is about 1–2 mm, subcutaneous fat varies from a few millimetres to centimetres between
 * people and body sites, and the skull is 5–8 mm thick.
 */
import type { TissueId } from '../em/tissue-properties';
import type { UsePositionKind } from './input';

export interface StackLayer {
  name: string;
  tissue: TissueId;
  /** m; null for the semi-infinite last layer. */
  thicknessM: number | null;
}

export type TissueStackId = 'head' | 'trunk' | 'limb';

export interface TissueStack {
  id: TissueStackId;
  /** Said in words beside the chart: which body part the flat layers stand for. */
  title: string;
  layers: readonly StackLayer[];
}

export const TISSUE_STACK_SOURCE =
  'Layer thicknesses: typical adult values, common practice (from memory, no single published source); tissue properties: Gabriel, Lau & Gabriel 1996 (Phys. Med. Biol. 41:2271) Cole-Cole model, densities IT’IS database v4.x';

/** Against the head: scalp skin, fat, skull, then brain as a half-space. */
export const HEAD_STACK: TissueStack = {
  id: 'head',
  title: 'Head: skin, fat, skull bone, brain',
  layers: [
    { name: 'skin', tissue: 'skin-dry', thicknessM: 0.0015 },
    { name: 'fat', tissue: 'fat', thicknessM: 0.0015 },
    { name: 'bone', tissue: 'bone-cortical', thicknessM: 0.006 },
    { name: 'brain', tissue: 'brain-grey-matter', thicknessM: null },
  ],
};

/** Body-worn, hotspot and farther positions face the trunk: skin, fat, then muscle as a half-space. */
export const TRUNK_STACK: TissueStack = {
  id: 'trunk',
  title: 'Trunk: skin, fat, muscle',
  layers: [
    { name: 'skin', tissue: 'skin-dry', thicknessM: 0.0015 },
    { name: 'fat', tissue: 'fat', thicknessM: 0.005 },
    { name: 'muscle', tissue: 'muscle', thicknessM: null },
  ],
};

/** Extremities (wrist, hand, ankle): skin, thin fat, muscle, then bone as a half-space. */
export const LIMB_STACK: TissueStack = {
  id: 'limb',
  title: 'Limb: skin, fat, muscle, bone',
  layers: [
    { name: 'skin', tissue: 'skin-dry', thicknessM: 0.0015 },
    { name: 'fat', tissue: 'fat', thicknessM: 0.002 },
    { name: 'muscle', tissue: 'muscle', thicknessM: 0.01 },
    { name: 'bone', tissue: 'bone-cortical', thicknessM: null },
  ],
};

const STACK_BY_KIND: Record<UsePositionKind, TissueStack> = {
  head: HEAD_STACK,
  'body-worn': TRUNK_STACK,
  hotspot: TRUNK_STACK,
  extremity: LIMB_STACK,
  'far-field': TRUNK_STACK,
};

/** The stack a use position of this kind faces. */
export function tissueStackFor(kind: UsePositionKind): TissueStack {
  return STACK_BY_KIND[kind];
}
