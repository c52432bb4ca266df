/**
 * Bump whenever a change to the core can change a figure, a finding or a status. Stored
 * verdicts carry only statuses and list figures (the detail is evaluated afresh), so a store
 * opened by a newer engine re-checks every build once to keep the list and the sheets agreed.
 */
export const ENGINE_VERSION = 2;
