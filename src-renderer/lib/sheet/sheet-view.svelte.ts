// What the reader of one build sheet has chosen to look at: which supply the power path and
// the checks follow, and which chart is shown. Nothing here is saved.

export type ChartView = 'run' | 'force' | 'propeller' | 'motor';

export class SheetViewState {
  supplyIndex = $state(0);
  chart = $state<ChartView | null>(null);

  /** The supply shown, kept inside the build's supplies when one is removed elsewhere. */
  shown(count: number): number {
    return Math.min(Math.max(0, this.supplyIndex), Math.max(0, count - 1));
  }

  /** The chart shown: the one chosen if the sheet offers it, else the sheet's first. */
  chartShown(offered: readonly ChartView[]): ChartView | null {
    return this.chart !== null && offered.includes(this.chart) ? this.chart : (offered[0] ?? null);
  }
}
