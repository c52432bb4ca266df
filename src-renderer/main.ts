import { mount, unmount } from 'svelte';
import App from './App.svelte';
import OpenWithToken from './components/OpenWithToken.svelte';
import { connect } from './lib/api/connect';
import './styles/base.css';

const target = document.getElementById('app');
if (!target) throw new Error('the page has no #app element');
const page = target;

// Without a usable token the page explains how to open Rigbook instead of showing an empty store.
function showHowToOpen(stale: boolean): void {
  mount(OpenWithToken, { target: page, props: { origin: window.location.origin, stale } });
  document.getElementById('open-title')?.focus();
  // Pasting the printed address into this tab changes only the fragment, which loads nothing: start over with it.
  window.addEventListener('hashchange', () => {
    if (/(?:^#|&)token=/.test(window.location.hash)) window.location.reload();
  });
}

let app: ReturnType<typeof mount> | null = null;
const client = connect(() => {
  if (app) void unmount(app);
  app = null;
  showHowToOpen(true);
});
if (client) app = mount(App, { target: page, props: { client } });
else showHowToOpen(false);
