import { parseRoute, formatRoute, type Route } from './routes';

/** The current screen, kept in step with the address bar's hash. */
export class Router {
  route = $state<Route>({ name: 'builds' });

  constructor(private readonly win: Window = window) {
    this.route = parseRoute(win.location.hash);
  }

  /** Starts following the address bar; returns the function that stops it. */
  start(): () => void {
    const onChange = () => {
      this.route = parseRoute(this.win.location.hash);
    };
    this.win.addEventListener('hashchange', onChange);
    return () => this.win.removeEventListener('hashchange', onChange);
  }

  go(route: Route): void {
    const hash = formatRoute(route);
    if (this.win.location.hash === hash) this.route = parseRoute(hash);
    else this.win.location.hash = hash;
  }
}
