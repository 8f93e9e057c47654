/** Product wording used on more than one screen. */
import type { Role } from './schemas/roles';

/** The caution every screen that may state a compliance result carries (DESIGN.md §7). */
export const CAUTION_TEXT =
  'Fieldfile results are engineering estimates or summaries of lab measurements. The certifying body and accredited labs decide; follow the applicable regulations and local codes.';

/** What each role will do in Fieldfile, in the user's words (DESIGN.md §2). */
export const ROLE_ABILITIES: Record<Role, string> = {
  admin: 'Manage the organisation’s people and their roles; read the audit trail and the mail outbox.',
  specialist: 'Create filings, work through each step, ask for review and answer change requests.',
  engineer: 'Enter and import measurements, upload evidence and fix failing checks.',
  approver: 'Review a filing version, request changes, or sign it by re-entering your password.',
};

