// Component tests opt into jsdom per file with `// @vitest-environment jsdom`;
// this adds the DOM matchers-free cleanup between tests there.
import { afterEach } from 'vitest';

afterEach(async () => {
  if (typeof document !== 'undefined') {
    const { cleanup } = await import('@testing-library/react');
    cleanup();
  }
});
