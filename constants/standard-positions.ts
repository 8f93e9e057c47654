/**
 * The trade's usual SAR test positions per product type, offered in the Use positions step as a
 * starting point (every one editable, none added twice). Each states its exposure condition (our
 * use-position kind), the SAR averaging mass, the test separation of the device surface from the
 * phantom, and where the practice is described. The FCC KDB numbers are from memory: check the
 * current revision of each publication before relying on a detail.
 */
import type { ProductType, UsePositionKind } from './schemas/device-file';

export interface StandardPosition {
  /** The label the position gets (users may rename it). */
  id: string;
  /** What the position is, in words. */
  surface: string;
  kind: UsePositionKind;
  /** SAR averaging mass, g: 1 g for head and body, 10 g for extremities (limbs, hands, wrists). */
  averagingMassG: 1 | 10;
  /** Test separation of the device surface from the phantom, m. */
  separationM: number;
  source: string;
}

export interface StandardPositionSet {
  label: string;
  /** What to know before adding the set. */
  note: string;
  positions: StandardPosition[];
}

// FCC KDB 648474 D04 (handsets), with IEEE Std 1528 / IEC/IEEE 62209-1528 for the head positions.
const HANDSET_SOURCE = 'FCC KDB 648474 D04 (handset SAR), head positions per IEC/IEEE 62209-1528:2020 (from memory)';
// FCC KDB 941225 D06: hotspot mode tested at 10 mm on the back, front and each edge within 25 mm of a transmitting antenna.
const HOTSPOT_SOURCE = 'FCC KDB 941225 D06 (hotspot: 10 mm, back, front and edges within 25 mm of an antenna) (from memory)';
// FCC KDB 616217 D04: tablets tested touching (0 mm) on the back and the edges within 25 mm of an antenna.
const TABLET_SOURCE = 'FCC KDB 616217 D04 (tablets: 0 mm, back and edges within 25 mm of an antenna) (from memory)';
// FCC KDB 447498 D01: extremity SAR averaged over 10 g; a wrist device held to the face for voice tested at 10 mm.
const WRIST_SOURCE = 'FCC KDB 447498 D01 (extremity 10 g SAR; wrist device at the face at 10 mm) (from memory)';

const head = (id: string, surface: string): StandardPosition => ({ id, surface, kind: 'head', averagingMassG: 1, separationM: 0, source: HANDSET_SOURCE });
const hotspotFace = (id: string, surface: string): StandardPosition => ({ id, surface, kind: 'hotspot', averagingMassG: 1, separationM: 0.01, source: HOTSPOT_SOURCE });
const tabletFace = (id: string, surface: string): StandardPosition => ({ id, surface, kind: 'body-worn', averagingMassG: 1, separationM: 0, source: TABLET_SOURCE });

const HOTSPOT_POSITIONS: StandardPosition[] = [
  hotspotFace('hotspot-back', 'Back surface toward the body'),
  hotspotFace('hotspot-front', 'Front surface toward the body'),
  hotspotFace('hotspot-top', 'Top edge (if within 25 mm of an antenna)'),
  hotspotFace('hotspot-bottom', 'Bottom edge (if within 25 mm of an antenna)'),
  hotspotFace('hotspot-left', 'Left edge (if within 25 mm of an antenna)'),
  hotspotFace('hotspot-right', 'Right edge (if within 25 mm of an antenna)'),
];

/** The body-worn accessory's separation: a common placeholder until the accessory's own is entered. */
export const BODY_WORN_ACCESSORY_SEPARATION_M = 0.015;

export const STANDARD_POSITION_SETS = {
  handset: {
    label: 'Handset',
    note: 'Body-worn starts at 15 mm: enter the separation your belt clip or holster gives. Remove hotspot edges more than 25 mm from every antenna.',
    positions: [
      head('left-cheek', 'Left side of the head, cheek (touch) position'),
      head('left-tilt', 'Left side of the head, tilted 15° from the cheek position'),
      head('right-cheek', 'Right side of the head, cheek (touch) position'),
      head('right-tilt', 'Right side of the head, tilted 15° from the cheek position'),
      {
        id: 'body-worn',
        surface: 'Back toward the body, at the body-worn accessory’s separation',
        kind: 'body-worn',
        averagingMassG: 1,
        separationM: BODY_WORN_ACCESSORY_SEPARATION_M,
        source: HANDSET_SOURCE,
      },
      ...HOTSPOT_POSITIONS,
    ],
  },
  hotspot: {
    label: 'Mobile hotspot',
    note: 'Remove the edges more than 25 mm from every antenna.',
    positions: HOTSPOT_POSITIONS,
  },
  tablet: {
    label: 'Tablet',
    note: 'Remove the edges more than 25 mm from every antenna.',
    positions: [
      tabletFace('tablet-back', 'Back surface, touching'),
      tabletFace('tablet-top', 'Top edge, touching (if within 25 mm of an antenna)'),
      tabletFace('tablet-bottom', 'Bottom edge, touching (if within 25 mm of an antenna)'),
      tabletFace('tablet-left', 'Left edge, touching (if within 25 mm of an antenna)'),
      tabletFace('tablet-right', 'Right edge, touching (if within 25 mm of an antenna)'),
    ],
  },
  'wrist-worn': {
    label: 'Wrist-worn',
    note: 'The face position applies when the device is held up to the face (e.g. for voice).',
    positions: [
      { id: 'wrist', surface: 'Back of the device on the wrist, touching', kind: 'extremity', averagingMassG: 10, separationM: 0, source: WRIST_SOURCE },
      { id: 'face', surface: 'Front of the device toward the face', kind: 'head', averagingMassG: 1, separationM: 0.01, source: WRIST_SOURCE },
    ],
  },
} satisfies Record<string, StandardPositionSet>;

export type StandardPositionSetKey = keyof typeof STANDARD_POSITION_SETS;
export const STANDARD_POSITION_SET_KEYS = Object.keys(STANDARD_POSITION_SETS) as StandardPositionSetKey[];

/**
 * The set that fits a product type. A module is tested in its host's positions: it has no set of
 * its own (the step asks which host's set to add). Types with no usual set get none.
 */
export const POSITION_SET_OF_PRODUCT: Partial<Record<ProductType, StandardPositionSetKey>> = {
  phone: 'handset',
  hotspot: 'hotspot',
  tablet: 'tablet',
  wearable: 'wrist-worn',
};

export const MODULE_POSITIONS_NOTE = 'A module is evaluated in the positions of the host it goes into: pick the host’s kind of product to add its usual positions.';

/** The positions of a set not already in the list (by label), in the set's order. */
export function standardPositionsToAdd(set: StandardPositionSetKey, existingIds: readonly (string | undefined)[]): StandardPosition[] {
  const taken = new Set(existingIds.filter(Boolean).map((id) => id!.toLowerCase()));
  return STANDARD_POSITION_SETS[set].positions.filter((p) => !taken.has(p.id.toLowerCase()));
}
