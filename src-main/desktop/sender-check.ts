import { isAppUrl } from './url-policy';

/** The parts of Electron's WebFrameMain the check reads. */
export interface SenderFrameLike {
  readonly url: string;
  readonly parent: unknown;
}

/**
 * An IPC call is served only when it comes from the top frame of a page on our own origin.
 * A missing frame (navigated away or destroyed) is refused.
 */
export function isTrustedSender(frame: SenderFrameLike | null | undefined): boolean {
  if (!frame) return false;
  if (frame.parent !== null) return false;
  return isAppUrl(frame.url);
}
