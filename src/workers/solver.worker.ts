/// <reference lib="webworker" />
import { expose } from 'comlink';
import { solverApi } from './solver-api';

// `self` explicitly: under @vitest/web-worker the default endpoint never answers.
expose(solverApi, self);
