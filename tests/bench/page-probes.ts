// Code that runs inside the page, kept as plain JavaScript text: functions handed to Playwright
// would carry the TypeScript loader's helpers (`__name`), which the page does not have. Times
// are the page's performance.now(); "painted" is taken in a message task posted from a
// requestAnimationFrame callback, which runs after that frame's style, layout and paint.

export interface FirstRowTimes {
  timeOrigin: number;
  /** performance.mark('rigbook:builds-data') set by the list state when the data arrived. */
  dataMark: number | null;
  firstRowInDom: number;
  firstRowPainted: number;
  /** The builds.listColumns request (the window's first list) as the browser saw it. */
  listRequest: { start: number; responseStart: number; end: number } | null;
}

export interface KeystrokeTimes {
  /** The keydown, seen by a capture listener on the window: the earliest point page code sees the key. */
  keydown: number;
  /** The last DOM change the keystroke caused (a mutation observer's callback), or null for none. */
  lastMutation: number | null;
  /** The callback of the first animation frame after the key. */
  frame: number;
  /** After that frame's rendering (style, layout, paint). */
  painted: number;
  countText: string;
  rows: number;
}

/** Installed before the page's own scripts: notes when the first build row enters the DOM and when it is painted. */
export const FIRST_ROW_PROBE = `(() => {
  const probe = (window.__rbFirstRow = {});
  const observer = new MutationObserver(() => {
    if (!document.querySelector('[data-testid="build-row"]')) return;
    observer.disconnect();
    probe.firstRowInDom = performance.now();
    requestAnimationFrame(() => {
      const channel = new MessageChannel();
      channel.port1.onmessage = () => {
        probe.firstRowPainted = performance.now();
        probe.done = true;
      };
      channel.port2.postMessage(0);
    });
  });
  observer.observe(document, { childList: true, subtree: true });
})()`;

/** Evaluates to FirstRowTimes once FIRST_ROW_DONE holds. */
export const READ_FIRST_ROW = `(() => {
  const probe = window.__rbFirstRow;
  const mark = performance.getEntriesByName('rigbook:builds-data', 'mark')[0];
  const request = performance.getEntriesByType('resource').find((e) => e.name.includes('/api/builds.listColumns'));
  return {
    timeOrigin: performance.timeOrigin,
    dataMark: mark ? mark.startTime : null,
    firstRowInDom: probe.firstRowInDom,
    firstRowPainted: probe.firstRowPainted,
    listRequest: request ? { start: request.startTime, responseStart: request.responseStart, end: request.responseEnd } : null,
  };
})()`;

/**
 * Arms a one-shot measurement of the next keystroke; AWAIT_KEYSTROKE then evaluates to its
 * KeystrokeTimes. The key's input event and the list's update run in the keydown's own task, so
 * the first frame after it is the first that can show the new list.
 */
export const ARM_KEYSTROKE = `(() => {
  window.__rbKey = new Promise((resolve) => {
    let lastMutation = null;
    const observer = new MutationObserver(() => {
      lastMutation = performance.now();
    });
    observer.observe(document.querySelector('.builds') || document.body, { childList: true, subtree: true, characterData: true, attributes: true });
    window.addEventListener('keydown', () => {
      const keydown = performance.now();
      requestAnimationFrame(() => {
        const frame = performance.now();
        const channel = new MessageChannel();
        channel.port1.onmessage = () => {
          const painted = performance.now();
          observer.disconnect();
          const count = document.querySelector('[data-testid="build-count"]');
          resolve({
            keydown,
            lastMutation,
            frame,
            painted,
            countText: count ? count.textContent.trim() : '',
            rows: document.querySelectorAll('[data-testid="build-row"]').length,
          });
        };
        channel.port2.postMessage(0);
      });
    }, { capture: true, once: true });
  });
})()`;

export const AWAIT_KEYSTROKE = 'window.__rbKey';
