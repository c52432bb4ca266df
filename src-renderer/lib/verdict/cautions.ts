// The cautions an over finding calls for come from the core's rule catalogue, so the sheet and
// the command line warn alike. What the screens add: whose word counts, and the cautions every
// printed sheet carries.

export { CAUTION_TEXT, type CautionTopic } from '$core/catalogue/cautions';
export { cautionsFor, cautionsOfAll } from '$core/catalogue/rules';

export const FOLLOW_RATINGS = "Follow the part maker's ratings and manuals, and local rules.";

/** Shown on every printed sheet, whatever the verdict. */
export const STANDING_CAUTIONS: readonly string[] = [
  'Lithium packs can burn: charge on a fire-safe surface, never unattended, and stop using packs that are swollen, damaged or hot.',
  'High currents heat wires and connectors: use wire and connectors rated for the peak current.',
  'Propellers injure: remove them while setting up on the bench, and keep clear when the power is connected.',
  'The figures are estimates from a first-order model and the ratings on record. Follow the part makers’ ratings and manuals, and local rules.',
];
