import '@fontsource/source-sans-3/latin-400.css';
import '@fontsource/source-sans-3/latin-600.css';
import './styles.css';
import { StrictMode } from 'react';
import { createRoot } from 'react-dom/client';
import { App } from './app/app';
import { registerAppWorker } from './lib/offline/register-worker';
import { keepPersonCache, restorePersonCache } from './lib/offline/persist-cache';
import { queryClient } from './lib/query-client';

const root = document.getElementById('root');
if (!root) throw new Error('The page has no #root element.');
const mount = root;

// The last person's saved queries first, so the first loaders find them when there is no signal.
void restorePersonCache(queryClient).then(() => {
  keepPersonCache(queryClient);
  createRoot(mount).render(
    <StrictMode>
      <App />
    </StrictMode>,
  );
  void registerAppWorker();
});
