// What the reader of one build sheet has chosen to look at: which supply the power path and
// the checks follow, and which chart is shown. Nothing here is saved.

export type ChartView = 'asks' | 'motor' | 'limits';

export class SheetViewState {
  supplyIndex = $state(0);
  chart = $state<ChartView | null>(null);

  /** The supply shown, kept inside the build's supplies when one is removed elsewhere. */
  shown(count: number): number {
    return Math.min(Math.max(0, this.supplyIndex), Math.max(0, count - 1));
  }
}
