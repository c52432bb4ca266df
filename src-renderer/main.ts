import { mount } from 'svelte';
import App from './App.svelte';
import { connect } from './lib/api/connect';
import './styles/base.css';

const target = document.getElementById('app');
if (!target) throw new Error('the page has no #app element');
mount(App, { target, props: { client: connect() } });
