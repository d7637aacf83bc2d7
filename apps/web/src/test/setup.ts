import '@testing-library/jest-dom/vitest';
import { cleanup, configure } from '@testing-library/react';
import { afterEach } from 'vitest';

// Pages load their code when first opened, as in the browser; in a test worker that first
// import also compiles the page's modules, which on a busy machine takes more than a second.
configure({ asyncUtilTimeout: 4000 });

afterEach(() => {
  cleanup();
});
