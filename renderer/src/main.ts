// Renderer entry: mounts the Svelte app into the page.
import { mount } from 'svelte';
import App from './App.svelte';
import './theme.css';

const target = document.getElementById('app');
if (!target) throw new Error('The page has no #app element to mount Stemline into.');
mount(App, { target });
