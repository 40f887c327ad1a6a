import { cleanup } from '@testing-library/react';
import { afterEach } from 'vitest';

// Vitest runs without globals, so Testing Library cannot unmount between tests by itself
afterEach(() => {
  cleanup();
});
