import { numberMarks, type NumberMarks } from '$core/number-text';

// Which locale's marks numbers are shown and typed with: the setting when one is chosen,
// else the system's (the browser's language). One value for the whole window, so what a
// screen prints is what a form reads back.

export { NUMBER_LOCALE_TAGS as NUMBER_LOCALES } from '$core/number-text';

function systemLocale(): string {
  const nav = (globalThis as { navigator?: { language?: string } }).navigator;
  return nav?.language || 'en-US';
}

class NumberLocale {
  chosen = $state('');
  tag = $derived(this.chosen === '' ? systemLocale() : this.chosen);
  marks = $derived<NumberMarks>(numberMarks(this.tag));
}

export const numberLocale = new NumberLocale();

export function setNumberLocale(chosen: string): void {
  numberLocale.chosen = chosen;
}

/** The system's locale as the browser reports it, for the settings screen. */
export function systemNumberLocale(): string {
  return systemLocale();
}
