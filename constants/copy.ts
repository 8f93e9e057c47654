/** Product wording used on more than one screen. */
import type { Role } from './schemas/roles';

/** The caution every screen that may state a compliance result carries (DESIGN.md §7). */
export const CAUTION_TEXT =
  'Fieldfile results are engineering estimates or summaries of lab measurements. The certifying body and accredited labs decide; follow the applicable regulations and local codes.';

/** What each role will do in Fieldfile, in the user's words (DESIGN.md §2). */
export const ROLE_ABILITIES: Record<Role, string> = {
  admin: 'Invite people, change their roles or deactivate them; read the activity record and the sent mail.',
  specialist: 'Create filings and fill in each step: device, radios, use positions, markets.',
  engineer: 'Read every filing and its screening; work on the lab steps a filing opens to engineers.',
  approver: 'Read every filing and its screening; review and sign the versions sent for approval.',
};
