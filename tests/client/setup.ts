import '@testing-library/jest-dom/vitest';
import { cleanup, configure } from '@testing-library/react';
import { afterEach } from 'vitest';

// findBy…/waitFor wait up to 1 s by default; under `npm test` the two cores also run the server and e2e
// projects, and a page that renders in 0.3 s alone took past 1 s there (the loads page's print sheet).
configure({ asyncUtilTimeout: 10_000 });

afterEach(() => {
  cleanup();
  // Each test starts with an empty localStorage (the walk-through keeps refused drafts there).
  localStorage.clear();
});
