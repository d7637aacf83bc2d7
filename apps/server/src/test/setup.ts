import { afterAll, beforeAll } from 'vitest';
import { closeTestContext, openTestContext, setTestContext, testContext } from './harness';

beforeAll(async () => {
  setTestContext(await openTestContext());
});

afterAll(async () => {
  await closeTestContext(testContext());
  setTestContext(null);
});
