import type { ApiInput } from '$service/handlers';
import type { Client } from '../api/client';
import { newlyOver, type NewlyOver, type ShiftPreview } from '../verdict/verdict-shift';

/** A write as `builds.preview` takes it: a build edit, a new build, or a part edit. */
export type PreviewRequest = ApiInput<'builds.preview'>;

export interface PendingConfirm {
  warnings: NewlyOver[];
  /** Name of a build the write creates (not in any list yet). */
  newName: string | null;
}

/**
 * Asks before a save that makes a build OVER: the change is previewed (the real write, rolled
 * back), and when any build would newly pass a limit the dialog says which and why, and the
 * save waits for the answer. A preview that fails lets the save go ahead: the save itself then
 * reports the problem by field, and writes nothing.
 */
export class OverConfirmState {
  pending = $state.raw<PendingConfirm | null>(null);
  #resolve: ((ok: boolean) => void) | null = null;

  constructor(private readonly client: Client) {}

  async confirm(request: PreviewRequest): Promise<boolean> {
    let preview: ShiftPreview;
    try {
      preview = await this.client.call('builds.preview', request);
    } catch {
      return true;
    }
    const newName = 'create' in request && typeof request.create.name === 'string' ? request.create.name : null;
    return this.confirmPreview(preview, newName);
  }

  /** For a screen that has just previewed the change itself (the swap preview). */
  confirmPreview(preview: ShiftPreview, newName: string | null = null): Promise<boolean> {
    const warnings = newlyOver(preview);
    if (warnings.length === 0) return Promise.resolve(true);
    this.#resolve?.(false);
    this.pending = { warnings, newName };
    return new Promise((resolve) => (this.#resolve = resolve));
  }

  answer(ok: boolean): void {
    const resolve = this.#resolve;
    this.#resolve = null;
    this.pending = null;
    resolve?.(ok);
  }
}
