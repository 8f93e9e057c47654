/**
 * Co-transmission: which transmitters can be on together, per use position. A group with no use
 * position holds in every use position (the device file's "simultaneous" list). The form, the API
 * and the lab results read the same shape; ids are the user's own labels.
 */
import { z } from 'zod';
import { MAX_COMBINATION_MEMBERS, MAX_COMBINATIONS } from '../../calc/input-limits';
import { zItemId } from './device-file';

export interface CoTransmissionGroup {
  /** Null: the group holds in every use position. */
  usePositionId: string | null;
  transmitterIds: string[];
}

export const zCoTransmissionGroup = z.strictObject({
  usePositionId: zItemId.nullable(),
  transmitterIds: z
    .array(zItemId)
    .min(2, 'Tick at least two transmitters that can be on together.')
    .max(MAX_COMBINATION_MEMBERS, `A group has at most ${MAX_COMBINATION_MEMBERS} transmitters.`)
    .refine((ids) => new Set(ids).size === ids.length, 'A group names each transmitter once.'),
});

const groupKey = (g: CoTransmissionGroup) => `${g.usePositionId ?? ''}\u0000${[...g.transmitterIds].sort().join('\u0000')}`;

export const zCoTransmissionBody = z.strictObject({
  groups: z
    .array(zCoTransmissionGroup)
    .max(MAX_COMBINATIONS, `At most ${MAX_COMBINATIONS} groups.`)
    .superRefine((groups, ctx) => {
      const seen = new Set<string>();
      groups.forEach((g, i) => {
        const key = groupKey(g);
        if (seen.has(key)) ctx.addIssue({ code: 'custom', path: [i, 'transmitterIds'], message: 'The same group is listed twice for this use position; remove one.' });
        seen.add(key);
      });
    }),
});
export type CoTransmissionBody = z.output<typeof zCoTransmissionBody>;

/** What GET answers: the groups and the revision a save names in If-Match. */
export interface CoTransmissionDto {
  version: number;
  groups: CoTransmissionGroup[];
  revision: string;
}
