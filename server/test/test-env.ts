/** Environment every server test runs with: the test database on the local instance. */
export const TEST_DB_NAME = process.env.DB_TEST_NAME ?? 'dwellform_test';

export const testEnv: NodeJS.ProcessEnv = {
  NODE_ENV: 'test',
  DB_NAME: TEST_DB_NAME,
  AUTH_RATE_LIMIT: '1000',
};
