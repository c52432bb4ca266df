// The builds list's text styles, as BuildsTable.svelte's style sheet sets them, for telling
// whether a cell's text fits its column without laying it out. A browser test checks the
// bounds drawn from these against the widths the browser lays the list out with.

/** A cell's side padding, both sides together (`.row > div`). */
export const CELL_PADDING = 12;

export type ListFont = 'body' | 'name' | 'small';

/** CSS font shorthands for the list's family: its body text, the build's name (semi-bold), the vehicle kind (`.small`). */
export function listFonts(family: string): Record<ListFont, string> {
  return { body: `400 13px ${family}`, name: `600 13px ${family}`, small: `400 12px ${family}` };
}
