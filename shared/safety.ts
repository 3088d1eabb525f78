/**
 * The safety caution, written once: the client's safety note and the player mails both show it
 * wherever Trenchwork shows technique coaching, cut or chop blocks, contact counts or practice plans.
 */
export const SAFETY_SUMMARY = 'Teach within your rules and contact limits; the medical staff decides return to play.';

export const SAFETY_POINTS: readonly string[] = [
  "Blocking is taught within the governing body's current rules: legal blocks, blocks below the waist, chop blocks and helmet contact.",
  'Practice contact limits follow your state association or conference.',
  'The athletic trainer and physicians decide when an injured player returns to play.',
  'Where local rules or licensed practice differ from anything shown here, they win.',
];

/** One paragraph for places without a list (the text part of a mail). */
export const SAFETY_TEXT = `Safety: ${SAFETY_POINTS.join(' ')}`;

// Blocks whose legality differs by level and changes often; a penalty list naming one earns the caution.
const RESTRICTED_BLOCK = /below the waist|chop|cut block|clipping/i;

/** Whether any of these penalty types is a restricted block (below the waist, chop, cut, clipping). */
export function namesRestrictedBlock(penaltyTypes: readonly string[]): boolean {
  return penaltyTypes.some((type) => RESTRICTED_BLOCK.test(type));
}
