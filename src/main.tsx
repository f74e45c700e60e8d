import { StrictMode } from 'react';
import { createRoot } from 'react-dom/client';
// JetBrains Mono is shipped with the app (no font CDN): labels, values and the wordmark use it.
import '@fontsource/jetbrains-mono/400.css';
import '@fontsource/jetbrains-mono/600.css';
import './index.css';
import { Providers } from './app/providers';
import { AppRouter } from './app/router';
import { preconnectBoard } from './features/canvas';

// A board's address: open its socket now, so that the document arrives while the app starts, checks the
// sign-in and asks for the board row (the board's session takes the socket up).
preconnectBoard(location.pathname, location.search);

const root = document.getElementById('root');
if (!root) throw new Error('index.html has no #root element');

createRoot(root).render(
  <StrictMode>
    <Providers>
      <AppRouter />
    </Providers>
  </StrictMode>,
);
