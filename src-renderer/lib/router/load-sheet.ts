// The build sheet and what only it uses (chart.js, the charts, the supply sections) are a chunk
// of their own, fetched the first time a sheet opens, so the list's first paint does not wait
// for them. The promise is kept: later sheets reuse the loaded module at once.
let sheet: Promise<typeof import('../../views/BuildSheetView.svelte')> | null = null;

export function loadSheet(): Promise<typeof import('../../views/BuildSheetView.svelte')> {
  sheet ??= import('../../views/BuildSheetView.svelte');
  return sheet;
}
