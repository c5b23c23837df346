// First: starts the reads the page's address tells (a route's page: the session and the
// route) while the rest of the code loads.
import './api/early';
import { StrictMode } from 'react';
import { createRoot } from 'react-dom/client';
import '@fontsource/lexend/400.css';
import '@fontsource/lexend/500.css';
import '@fontsource/lexend/600.css';
import './index.css';
import { App } from './app/app';

const root = document.getElementById('root');
if (!root) throw new Error('The page has no #root element.');

createRoot(root).render(
  <StrictMode>
    <App />
  </StrictMode>,
);
