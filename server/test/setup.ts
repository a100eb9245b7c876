// Runs in each server test file before its imports: point config at the test database.
import { testEnv } from './test-env';

Object.assign(process.env, testEnv);
