import '@testing-library/jest-dom/vitest';
import { cleanup } from '@testing-library/react';
import { afterEach } from 'vitest';

afterEach(() => {
  cleanup();
  // Each test starts with an empty localStorage (the walk-through keeps refused drafts there).
  localStorage.clear();
});
