import '@fontsource/source-sans-3/latin-400.css';
import '@fontsource/source-sans-3/latin-600.css';
import './styles.css';
import { StrictMode } from 'react';
import { createRoot } from 'react-dom/client';
import { App } from './app/app';
import { registerAppWorker } from './lib/offline/register-worker';
import { hasSavedPerson } from './lib/offline/last-person';
import { queryClient } from './lib/query-client';

const root = document.getElementById('root');
if (!root) throw new Error('The page has no #root element.');
const mount = root;

// The last person's saved queries first, so the first loaders find them when there is no signal. With
// nobody saved on this device (a first sign-in) the cache code is not loaded here: the guard starts it.
const restored = hasSavedPerson()
  ? import('./lib/offline/persist-cache').then(async (m) => {
      await m.restorePersonCache(queryClient);
      m.keepPersonCacheOnce(queryClient);
    })
  : Promise.resolve();
void restored
  .catch(() => undefined)
  .then(() => {
    createRoot(mount).render(
      <StrictMode>
        <App />
      </StrictMode>,
    );
    void registerAppWorker();
  });
