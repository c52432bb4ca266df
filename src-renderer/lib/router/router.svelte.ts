import { parseRoute, formatRoute, type Route } from './routes';

/** Says why leaving the current screen would lose something, or null when nothing would be lost. */
export type LeaveCheck = () => string | null;

/** The current screen, kept in step with the address bar's hash. */
export class Router {
  route = $state<Route>({ name: 'builds' });
  private readonly holds = new Set<LeaveCheck>();
  private hash: string;

  constructor(private readonly win: Window = window) {
    this.route = parseRoute(win.location.hash);
    this.hash = win.location.hash;
  }

  /**
   * Registers a screen's unsaved work: while `check` returns a message, leaving the screen (a
   * link, the back button, a reload or closing the window) asks first. Returns the release.
   */
  hold(check: LeaveCheck): () => void {
    this.holds.add(check);
    return () => this.holds.delete(check);
  }

  private pending(): string | null {
    for (const check of this.holds) {
      const message = check();
      if (message) return message;
    }
    return null;
  }

  /** Starts following the address bar; returns the function that stops it. */
  start(): () => void {
    const onChange = () => {
      const next = this.win.location.hash;
      if (next === this.hash) return;
      const message = this.pending();
      if (message && !this.win.confirm(`${message}\n\nLeave this screen and lose them?`)) {
        // Put the address back without a second hashchange; the screen never changed.
        this.win.history.replaceState(this.win.history.state, '', this.hash === '' ? this.win.location.pathname + this.win.location.search : this.hash);
        return;
      }
      this.hash = next;
      this.route = parseRoute(next);
    };
    const onUnload = (event: BeforeUnloadEvent) => {
      if (this.pending() === null) return;
      event.preventDefault();
      // Older engines show their own question only when returnValue is set.
      event.returnValue = '';
    };
    this.win.addEventListener('hashchange', onChange);
    this.win.addEventListener('beforeunload', onUnload);
    return () => {
      this.win.removeEventListener('hashchange', onChange);
      this.win.removeEventListener('beforeunload', onUnload);
    };
  }

  go(route: Route): void {
    const hash = formatRoute(route);
    if (this.win.location.hash === hash) this.route = parseRoute(hash);
    else this.win.location.hash = hash;
  }
}
